/* SPDX-License-Identifier: GPL-3.0-or-later */
/* LaminaJobDeleteDialog: delete a job with its schedule.  The question
 * names the job and how many entries go with it; the library's
 * constructions stay.  A job submitted or built may have sheets with
 * building control or on site, so Delete is offered only once its job
 * number is typed in full — a deliberate act, not a click. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-job-delete-dialog-private.h"

#include <glib/gi18n.h>
#include <string.h>

G_DEFINE_FINAL_TYPE (LaminaJobDeleteDialog, lamina_job_delete_dialog, GTK_TYPE_WINDOW)

enum { DELETED, N_SIGNALS };
static guint signals[N_SIGNALS];

const char *
lamina_job_delete_dialog_get_key (LaminaJobDeleteDialog *self)
{
  g_return_val_if_fail (LAMINA_IS_JOB_DELETE_DIALOG (self), NULL);
  if (self->job->status == LAMINA_JOB_STATUS_DESIGN)
    return NULL;
  return self->job->number ? self->job->number : self->job->id;
}

static gboolean
key_typed (LaminaJobDeleteDialog *self)
{
  const char *key = lamina_job_delete_dialog_get_key (self);
  g_autofree char *typed = NULL;

  if (key == NULL)
    return TRUE;
  typed = g_strstrip (g_strdup (gtk_editable_get_text (GTK_EDITABLE (self->key_entry))));
  return strcmp (typed, key) == 0;
}

static void
on_key_changed_cb (LaminaJobDeleteDialog *self)
{
  gtk_widget_set_sensitive (GTK_WIDGET (self->delete_button), key_typed (self));
}

gboolean
lamina_job_delete_dialog_delete (LaminaJobDeleteDialog  *self,
                                 GError                **error)
{
  g_autofree char *id = NULL;

  g_return_val_if_fail (LAMINA_IS_JOB_DELETE_DIALOG (self), FALSE);
  if (!key_typed (self))
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID,
                   _("Job number: type “%s” to delete this job"), lamina_job_delete_dialog_get_key (self));
      gtk_widget_grab_focus (GTK_WIDGET (self->key_entry));
      return FALSE;
    }
  if (!lamina_library_delete_job (self->library, self->job->id, error))
    return FALSE;
  id = g_strdup (self->job->id);
  g_signal_emit (self, signals[DELETED], 0, id);
  gtk_window_destroy (GTK_WINDOW (self));
  return TRUE;
}

static void
on_delete_clicked_cb (LaminaJobDeleteDialog *self)
{
  g_autoptr(GError) error = NULL;

  if (!lamina_job_delete_dialog_delete (self, &error))
    gtk_label_set_text (self->error_label, error->message);
}

static void
lamina_job_delete_dialog_dispose (GObject *object)
{
  LaminaJobDeleteDialog *self = LAMINA_JOB_DELETE_DIALOG (object);

  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_JOB_DELETE_DIALOG);
  g_clear_object (&self->library);
  G_OBJECT_CLASS (lamina_job_delete_dialog_parent_class)->dispose (object);
}

static void
lamina_job_delete_dialog_finalize (GObject *object)
{
  LaminaJobDeleteDialog *self = LAMINA_JOB_DELETE_DIALOG (object);

  g_clear_pointer (&self->job, lamina_job_free);
  G_OBJECT_CLASS (lamina_job_delete_dialog_parent_class)->finalize (object);
}

static void
lamina_job_delete_dialog_class_init (LaminaJobDeleteDialogClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_job_delete_dialog_dispose;
  object_class->finalize = lamina_job_delete_dialog_finalize;
  signals[DELETED] = g_signal_new ("deleted", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0,
                                   NULL, NULL, NULL, G_TYPE_NONE, 1, G_TYPE_STRING);
  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-job-delete-dialog.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDeleteDialog, question_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDeleteDialog, detail_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDeleteDialog, key_box);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDeleteDialog, key_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDeleteDialog, key_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDeleteDialog, error_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDeleteDialog, delete_button);
  gtk_widget_class_bind_template_callback (widget_class, on_key_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, on_delete_clicked_cb);
  gtk_widget_class_bind_template_callback (widget_class, gtk_window_destroy);
}

static void
lamina_job_delete_dialog_init (LaminaJobDeleteDialog *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
}

static const char *
status_label (LaminaJobStatus status)
{
  return status == LAMINA_JOB_STATUS_BUILT ? _("built") : _("submitted");
}

LaminaJobDeleteDialog *
lamina_job_delete_dialog_new (GtkWindow       *parent,
                              LaminaLibrary   *library,
                              const LaminaJob *job)
{
  LaminaJobDeleteDialog *self = g_object_new (LAMINA_TYPE_JOB_DELETE_DIALOG, "transient-for", parent, NULL);
  guint n = job->entries->len;
  g_autofree char *question = NULL;
  g_autofree char *detail = NULL;
  g_autofree char *key_text = NULL;
  const char *key;

  self->library = g_object_ref (library);
  self->job = lamina_job_copy (job);
  key = lamina_job_delete_dialog_get_key (self);
  question = job->number
    ? g_strdup_printf (_("Delete the job %s “%s”?"), job->number, job->name)
    : g_strdup_printf (_("Delete the job “%s”?"), job->name);
  detail = g_strdup_printf (g_dngettext (GETTEXT_PACKAGE,
                                         "Its schedule of %u entry goes with it, with its junctions and "
                                         "its log. The library's constructions stay. This cannot be undone.",
                                         "Its schedule of %u entries goes with it, with its junctions and "
                                         "its log. The library's constructions stay. This cannot be undone.", n),
                            n);
  gtk_label_set_text (self->question_label, question);
  gtk_label_set_text (self->detail_label, detail);
  gtk_widget_set_visible (GTK_WIDGET (self->key_box), key != NULL);
  if (key != NULL)
    {
      key_text = g_strdup_printf (job->number
                                  ? _("The job is %s: its sheets may be with building control or on site. "
                                      "Type its job number, %s, to delete it.")
                                  : _("The job is %s: its sheets may be with building control or on site. "
                                      "It has no job number: type its id, %s, to delete it."),
                                  status_label (job->status), key);
      gtk_label_set_text (self->key_label, key_text);
      gtk_window_set_focus (GTK_WINDOW (self), GTK_WIDGET (self->key_entry));
    }
  on_key_changed_cb (self);
  return self;
}
