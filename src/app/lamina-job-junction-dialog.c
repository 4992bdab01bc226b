/* SPDX-License-Identifier: GPL-3.0-or-later */
/* LaminaJobJunctionDialog: add or change a hand-entered ψ·l of a job. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-job-junction-dialog-private.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-job-fields.h"

G_DEFINE_FINAL_TYPE (LaminaJobJunctionDialog, lamina_job_junction_dialog, GTK_TYPE_WINDOW)

enum { SAVED, N_SIGNALS };
static guint signals[N_SIGNALS];

static LaminaJobJunction *
find_junction (const LaminaJob *job,
               int              n)
{
  for (guint i = 0; i < job->junctions->len; i++)
    if (((LaminaJobJunction *) job->junctions->pdata[i])->n == n)
      return job->junctions->pdata[i];
  return NULL;
}

gboolean
lamina_job_junction_dialog_save (LaminaJobJunctionDialog  *self,
                                 GError                  **error)
{
  g_autoptr(LaminaJob) job = lamina_job_copy (self->job);
  g_autofree char *name = lamina_job_fields_dup_text (self->name_entry);
  LaminaJobJunction *j;
  double psi = NAN, length = NAN;

  lamina_job_fields_clear_mark (self->name_entry);
  if (name == NULL)
    return lamina_job_fields_refuse (self->name_entry, _("Name"), _("say which junction it is"), error);
  if (!lamina_job_fields_parse (self->psi_entry, _("ψ"), LAMINA_FIELD_PSI, FALSE, &psi, error)
      || !lamina_job_fields_parse (self->length_entry, _("Length"), LAMINA_FIELD_LENGTH, FALSE, &length, error))
    return FALSE;
  j = self->n > 0 ? find_junction (job, self->n) : lamina_job_add_junction (job, lamina_job_junction_new (name, psi, length));
  g_free (j->name);
  j->name = g_steal_pointer (&name);
  j->psi = psi;
  j->length = length;
  if (!lamina_library_save_job (self->library, job, error))
    return FALSE;
  g_signal_emit (self, signals[SAVED], 0, job->id);
  gtk_window_destroy (GTK_WINDOW (self));
  return TRUE;
}

static void
on_save_clicked_cb (LaminaJobJunctionDialog *self)
{
  g_autoptr(GError) error = NULL;

  if (!lamina_job_junction_dialog_save (self, &error))
    gtk_label_set_text (self->error_label, error->message);
}

static void
lamina_job_junction_dialog_dispose (GObject *object)
{
  LaminaJobJunctionDialog *self = LAMINA_JOB_JUNCTION_DIALOG (object);

  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_JOB_JUNCTION_DIALOG);
  g_clear_object (&self->library);
  G_OBJECT_CLASS (lamina_job_junction_dialog_parent_class)->dispose (object);
}

static void
lamina_job_junction_dialog_finalize (GObject *object)
{
  LaminaJobJunctionDialog *self = LAMINA_JOB_JUNCTION_DIALOG (object);

  g_clear_pointer (&self->job, lamina_job_free);
  G_OBJECT_CLASS (lamina_job_junction_dialog_parent_class)->finalize (object);
}

static void
lamina_job_junction_dialog_class_init (LaminaJobJunctionDialogClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_job_junction_dialog_dispose;
  object_class->finalize = lamina_job_junction_dialog_finalize;
  signals[SAVED] = g_signal_new ("saved", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0,
                                 NULL, NULL, NULL, G_TYPE_NONE, 1, G_TYPE_STRING);
  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-job-junction-dialog.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaJobJunctionDialog, name_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobJunctionDialog, psi_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobJunctionDialog, length_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobJunctionDialog, error_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobJunctionDialog, save_button);
  gtk_widget_class_bind_template_callback (widget_class, on_save_clicked_cb);
  gtk_widget_class_bind_template_callback (widget_class, gtk_window_destroy);
}

static void
lamina_job_junction_dialog_init (LaminaJobJunctionDialog *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
}

LaminaJobJunctionDialog *
lamina_job_junction_dialog_new (GtkWindow     *parent,
                                LaminaLibrary *library,
                                const char    *job_id,
                                int            n,
                                GError       **error)
{
  g_autoptr(LaminaJob) job = lamina_library_dup_job (library, job_id, error);
  const LaminaJobJunction *j = NULL;
  LaminaJobJunctionDialog *self;

  if (job == NULL)
    return NULL;
  if (n > 0 && (j = find_junction (job, n)) == NULL)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                   _("job “%s” has no junction %d"), job_id, n);
      return NULL;
    }
  self = g_object_new (LAMINA_TYPE_JOB_JUNCTION_DIALOG, "transient-for", parent, NULL);
  self->library = g_object_ref (library);
  self->n = n;
  if (j != NULL)
    {
      gtk_editable_set_text (GTK_EDITABLE (self->name_entry), j->name ? j->name : "");
      lamina_job_fields_set_number (self->psi_entry, j->psi, 4);
      lamina_job_fields_set_number (self->length_entry, j->length, 2);
    }
  self->job = g_steal_pointer (&job);
  return self;
}
