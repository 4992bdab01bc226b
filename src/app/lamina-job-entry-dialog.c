/* SPDX-License-Identifier: GPL-3.0-or-later */
/* LaminaJobEntryDialog: change one schedule entry.  The revisions are the
 * construction's history with their review status, so that the approved
 * one is plain to see; choosing another is the user's act and goes to the
 * job's log (lamina_library_move_job_entry). */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-job-entry-dialog-private.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-job-fields.h"

G_DEFINE_FINAL_TYPE (LaminaJobEntryDialog, lamina_job_entry_dialog, GTK_TYPE_WINDOW)

enum { SAVED, N_SIGNALS };
static guint signals[N_SIGNALS];

/* Uses offered when the job has no target set (common practice). */
static const char *const default_uses[] = {
  "external-wall", "roof", "floor-ground", "floor-outside-air", "wall-unheated", NULL,
};

gboolean
lamina_job_entry_dialog_save (LaminaJobEntryDialog  *self,
                              GError               **error)
{
  g_autoptr(LaminaJob) job = lamina_job_copy (self->job);
  LaminaJobEntry *e = lamina_job_find_entry (job, self->n);
  guint r = gtk_drop_down_get_selected (self->revision_dropdown);
  guint u = gtk_drop_down_get_selected (self->use_dropdown);
  int revision = r < self->revisions->len ? g_array_index (self->revisions, int, r) : e->revision;
  double area = NAN;

  g_return_val_if_fail (e != NULL, FALSE);
  if (!lamina_job_fields_parse (self->area_entry, _("Area"), LAMINA_FIELD_AREA, TRUE, &area, error))
    return FALSE;
  e->area = area;
  g_free (e->location);
  e->location = lamina_job_fields_dup_text (self->location_entry);
  if (u < g_strv_length (self->uses))
    {
      g_free (e->use);
      e->use = g_strdup (self->uses[u]);
    }
  if (!lamina_library_save_job (self->library, job, error))
    return FALSE;
  if (revision != e->revision
      && !lamina_library_move_job_entry (self->library, job->id, self->n, revision, NULL, error))
    {
      g_prefix_error (error, _("Revision: "));
      return FALSE;
    }
  g_signal_emit (self, signals[SAVED], 0, job->id);
  gtk_window_destroy (GTK_WINDOW (self));
  return TRUE;
}

static void
on_save_clicked_cb (LaminaJobEntryDialog *self)
{
  g_autoptr(GError) error = NULL;

  if (!lamina_job_entry_dialog_save (self, &error))
    gtk_label_set_text (self->error_label, error->message);
}

static void
fill_revisions (LaminaJobEntryDialog *self,
                const LaminaJobEntry *e)
{
  g_autoptr(GPtrArray) history = lamina_library_dup_history (self->library, e->construction, NULL);

  if (lamina_job_fields_fill_revisions (self->revision_dropdown, self->revisions, history, e->revision,
                                        _(" (pinned)"), e->revision) == 0)
    {
      g_autofree char *label = g_strdup_printf (_("Revision %d — not in the library"), e->revision);
      g_autoptr(GtkStringList) labels = gtk_string_list_new (NULL);

      g_array_append_val (self->revisions, e->revision);
      gtk_string_list_append (labels, label);
      gtk_drop_down_set_model (self->revision_dropdown, G_LIST_MODEL (labels));
    }
}

static void
fill_uses (LaminaJobEntryDialog  *self,
           const LaminaJobEntry  *e,
           const LaminaTargetSet *targets)
{
  g_autoptr(GStrvBuilder) uses = g_strv_builder_new ();
  g_autoptr(GtkStringList) labels = gtk_string_list_new (NULL);
  guint selected = 0, n = 0;

  for (guint i = 0; targets != NULL && i < targets->targets->len; i++, n++)
    {
      const LaminaTarget *t = targets->targets->pdata[i];

      g_strv_builder_add (uses, t->use);
      gtk_string_list_append (labels, t->label ? t->label : t->use);
      if (g_strcmp0 (t->use, e->use) == 0)
        selected = n;
    }
  for (guint i = 0; targets == NULL && default_uses[i] != NULL; i++, n++)
    {
      g_strv_builder_add (uses, default_uses[i]);
      gtk_string_list_append (labels, default_uses[i]);
      if (g_strcmp0 (default_uses[i], e->use) == 0)
        selected = n;
    }
  if (targets == NULL && !g_strv_contains (default_uses, e->use))
    {
      g_strv_builder_add (uses, e->use);
      gtk_string_list_append (labels, e->use);
      selected = n;
    }
  self->uses = g_strv_builder_end (uses);
  gtk_drop_down_set_model (self->use_dropdown, G_LIST_MODEL (labels));
  gtk_drop_down_set_selected (self->use_dropdown, selected);
}

static void
lamina_job_entry_dialog_dispose (GObject *object)
{
  LaminaJobEntryDialog *self = LAMINA_JOB_ENTRY_DIALOG (object);

  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_JOB_ENTRY_DIALOG);
  g_clear_object (&self->library);
  G_OBJECT_CLASS (lamina_job_entry_dialog_parent_class)->dispose (object);
}

static void
lamina_job_entry_dialog_finalize (GObject *object)
{
  LaminaJobEntryDialog *self = LAMINA_JOB_ENTRY_DIALOG (object);

  g_clear_pointer (&self->job, lamina_job_free);
  g_clear_pointer (&self->revisions, g_array_unref);
  g_clear_pointer (&self->uses, g_strfreev);
  G_OBJECT_CLASS (lamina_job_entry_dialog_parent_class)->finalize (object);
}

static void
lamina_job_entry_dialog_class_init (LaminaJobEntryDialogClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_job_entry_dialog_dispose;
  object_class->finalize = lamina_job_entry_dialog_finalize;
  signals[SAVED] = g_signal_new ("saved", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0,
                                 NULL, NULL, NULL, G_TYPE_NONE, 1, G_TYPE_STRING);
  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-job-entry-dialog.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaJobEntryDialog, title_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobEntryDialog, revision_dropdown);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobEntryDialog, use_dropdown);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobEntryDialog, location_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobEntryDialog, area_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobEntryDialog, error_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobEntryDialog, save_button);
  gtk_widget_class_bind_template_callback (widget_class, on_save_clicked_cb);
  gtk_widget_class_bind_template_callback (widget_class, gtk_window_destroy);
}

static void
lamina_job_entry_dialog_init (LaminaJobEntryDialog *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  self->revisions = g_array_new (FALSE, FALSE, sizeof (int));
}

LaminaJobEntryDialog *
lamina_job_entry_dialog_new (GtkWindow     *parent,
                             LaminaLibrary *library,
                             const char    *job_id,
                             int            n,
                             GError       **error)
{
  g_autoptr(LaminaJob) job = lamina_library_dup_job (library, job_id, error);
  g_autoptr(LaminaTargetSet) targets = NULL;
  g_autoptr(LaminaConstruction) c = NULL;
  const LaminaJobEntry *e;
  LaminaJobEntryDialog *self;
  g_autofree char *title = NULL;

  if (job == NULL)
    return NULL;
  e = lamina_job_find_entry (job, n);
  if (e == NULL)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                   _("job “%s” has no entry %d"), job_id, n);
      return NULL;
    }
  if (job->target_set != NULL)
    targets = lamina_library_dup_target_set (library, job->target_set, NULL);
  c = lamina_library_dup_construction (library, e->construction, e->revision, NULL);
  self = g_object_new (LAMINA_TYPE_JOB_ENTRY_DIALOG, "transient-for", parent, NULL);
  self->library = g_object_ref (library);
  self->n = n;
  title = g_strdup_printf (_("Entry %d: %s %s"), n, c && c->code ? c->code : e->construction,
                           c ? c->name : "");
  gtk_label_set_text (self->title_label, title);
  fill_revisions (self, e);
  fill_uses (self, e, targets);
  gtk_editable_set_text (GTK_EDITABLE (self->location_entry), e->location ? e->location : "");
  lamina_job_fields_set_number (self->area_entry, e->area, 2);
  self->job = g_steal_pointer (&job);
  return self;
}
