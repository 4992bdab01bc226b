/* SPDX-License-Identifier: GPL-3.0-or-later */
/* LaminaJobAddDialog: pick a library construction for a job's schedule.
 * The use comes first: its target sets the filter (maximum U and the
 * element kind the use is for), so the list shows what qualifies.  The
 * chosen construction's revisions follow, the latest approved selected
 * (else the latest, noted as not approved), as `job add --revision`. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-job-add-dialog-private.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-job-fields.h"
#include "lamina-number.h"

/* Common uses offered when the job has no target set. */
static const char *const default_uses[] = {
  "external-wall", "roof", "floor-ground", "floor-outside-air", "wall-unheated", NULL,
};


G_DEFINE_FINAL_TYPE (LaminaJobAddDialog, lamina_job_add_dialog, GTK_TYPE_WINDOW)

static const LaminaTarget *
get_target (LaminaJobAddDialog *self)
{
  guint selected = gtk_drop_down_get_selected (self->use_dropdown);

  if (self->targets == NULL || selected >= g_strv_length (self->uses))
    return NULL;
  return lamina_target_set_find (self->targets, self->uses[selected]);
}

double
lamina_job_add_dialog_get_max_u (LaminaJobAddDialog *self)
{
  const LaminaTarget *t = get_target (self);

  return t != NULL && gtk_check_button_get_active (self->meets_check) ? t->max_u : NAN;
}

int
lamina_job_add_dialog_get_element (LaminaJobAddDialog *self)
{
  const LaminaTarget *t = get_target (self);

  return t != NULL ? t->element : -1;
}

GPtrArray *
lamina_job_add_dialog_get_results (LaminaJobAddDialog *self)
{
  return self->results;
}

static GtkWidget *
create_row (const LaminaSummary *s)
{
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 10);
  GtkWidget *code = gtk_label_new (s->code ? s->code : s->id);
  GtkWidget *name = gtk_label_new (s->name);
  GtkWidget *status = gtk_label_new (lamina_status_to_string (s->status));
  char u[LAMINA_U_TEXT_SIZE];
  GtkWidget *u_label = gtk_label_new (lamina_format_u (u, s->u_corrected));

  gtk_widget_add_css_class (code, "lamina-row-code");
  gtk_label_set_width_chars (GTK_LABEL (code), 8);
  gtk_label_set_xalign (GTK_LABEL (code), 0);
  gtk_widget_set_hexpand (name, TRUE);
  gtk_label_set_xalign (GTK_LABEL (name), 0);
  gtk_label_set_ellipsize (GTK_LABEL (name), PANGO_ELLIPSIZE_END);
  gtk_widget_add_css_class (status, "lamina-status");
  gtk_widget_add_css_class (status, lamina_status_to_string (s->status));
  gtk_widget_add_css_class (u_label, "lamina-row-u");
  gtk_box_append (GTK_BOX (box), code);
  gtk_box_append (GTK_BOX (box), name);
  gtk_box_append (GTK_BOX (box), status);
  gtk_box_append (GTK_BOX (box), u_label);
  gtk_widget_add_css_class (box, "lamina-library-row");
  return box;
}

static void
update_revision_note (LaminaJobAddDialog *self)
{
  guint selected = gtk_drop_down_get_selected (self->revision_dropdown);
  g_autofree char *note = NULL;
  int latest_approved = 0;

  for (guint i = 0; i < self->approved->len && latest_approved == 0; i++)
    if (g_array_index (self->approved, gboolean, i))
      latest_approved = g_array_index (self->revisions, int, i);
  if (selected >= self->revisions->len)
    ;
  else if (!g_array_index (self->approved, gboolean, selected))
    note = g_strdup_printf (_("⚠ Revision %d is not approved: the entry is flagged until it is moved "
                              "to an approved revision."), g_array_index (self->revisions, int, selected));
  else if (g_array_index (self->revisions, int, selected) != latest_approved)
    note = g_strdup_printf (_("Revision %d is the latest approved."), latest_approved);
  gtk_label_set_text (self->revision_note, note ? note : "");
}

static void
on_revision_changed_cb (LaminaJobAddDialog *self)
{
  if (self->revisions != NULL)
    update_revision_note (self);
}

static void
clear_choice (LaminaJobAddDialog *self)
{
  g_autoptr(GtkStringList) none = gtk_string_list_new (NULL);

  g_clear_pointer (&self->chosen_id, g_free);
  g_array_set_size (self->revisions, 0);
  g_array_set_size (self->approved, 0);
  gtk_drop_down_set_model (self->revision_dropdown, G_LIST_MODEL (none));
  gtk_widget_set_sensitive (GTK_WIDGET (self->revision_dropdown), FALSE);
  gtk_label_set_text (self->revision_note, _("Choose a construction to see its revisions."));
}

void
lamina_job_add_dialog_choose (LaminaJobAddDialog *self,
                              guint               index)
{
  const LaminaSummary *s;
  g_autoptr(GPtrArray) history = NULL;
  g_autoptr(GError) error = NULL;
  gboolean approved = FALSE;
  int pick;

  g_return_if_fail (index < self->results->len);
  s = self->results->pdata[index];
  if (gtk_list_box_get_selected_row (self->result_list) != gtk_list_box_get_row_at_index (self->result_list, (int) index))
    {
      /* Selecting the row comes back here through row-selected. */
      gtk_list_box_select_row (self->result_list, gtk_list_box_get_row_at_index (self->result_list, (int) index));
      return;
    }
  clear_choice (self);
  history = lamina_library_dup_history (self->library, s->id, &error);
  pick = history != NULL ? lamina_library_pick_revision (self->library, s->id, 0, &approved, &error) : 0;
  if (pick == 0)
    {
      gtk_label_set_text (self->revision_note, error->message);
      return;
    }
  for (guint i = 0; i < history->len; i++)
    {
      gboolean a = ((const LaminaRevisionInfo *) history->pdata[i])->status == LAMINA_STATUS_APPROVED;

      g_array_append_val (self->approved, a);
    }
  self->chosen_id = g_strdup (s->id);
  lamina_job_fields_fill_revisions (self->revision_dropdown, self->revisions, history, pick,
                                    approved ? _(" (latest approved)") : _(" (latest; none approved)"), pick);
  gtk_widget_set_sensitive (GTK_WIDGET (self->revision_dropdown), TRUE);
  update_revision_note (self);
}

static void
on_row_selected_cb (LaminaJobAddDialog *self,
                    GtkListBoxRow      *row)
{
  /* The list unselects its rows as the dialog goes. */
  if (self->revision_dropdown == NULL)
    return;
  if (row == NULL)
    clear_choice (self);
  else
    lamina_job_add_dialog_choose (self, (guint) gtk_list_box_row_get_index (row));
}

int
lamina_job_add_dialog_get_revision (LaminaJobAddDialog *self)
{
  guint selected = gtk_drop_down_get_selected (self->revision_dropdown);

  return self->chosen_id != NULL && selected < self->revisions->len
         ? g_array_index (self->revisions, int, selected) : 0;
}

gboolean
lamina_job_add_dialog_set_revision (LaminaJobAddDialog *self,
                                    int                 revision)
{
  for (guint i = 0; self->chosen_id != NULL && i < self->revisions->len; i++)
    if (g_array_index (self->revisions, int, i) == revision)
      {
        gtk_drop_down_set_selected (self->revision_dropdown, i);
        return TRUE;
      }
  return FALSE;
}

static void
refresh (LaminaJobAddDialog *self)
{
  LaminaLibraryQuery q;
  g_autoptr(GError) error = NULL;
  const char *text = gtk_editable_get_text (GTK_EDITABLE (self->search_entry));
  double max_u = lamina_job_add_dialog_get_max_u (self);
  int element = lamina_job_add_dialog_get_element (self);
  char u[LAMINA_U_TEXT_SIZE];
  g_autofree char *filter = NULL;
  /* A choice survives a new search that still lists it. */
  g_autofree char *kept = g_strdup (self->chosen_id);
  int kept_revision = lamina_job_add_dialog_get_revision (self);
  GtkWidget *child;

  lamina_library_query_init (&q);
  q.text = *text ? text : NULL;
  q.max_u = max_u;
  q.element = element;
  q.limit = 300;
  g_clear_pointer (&self->results, g_ptr_array_unref);
  self->results = lamina_library_search (self->library, &q, &error);
  if (self->results == NULL)
    {
      gtk_label_set_text (self->error_label, error->message);
      self->results = g_ptr_array_new ();
    }
  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->result_list))) != NULL)
    gtk_list_box_remove (self->result_list, child);
  clear_choice (self);
  for (guint i = 0; i < self->results->len; i++)
    gtk_list_box_append (self->result_list, create_row (self->results->pdata[i]));
  for (guint i = 0; kept != NULL && i < self->results->len; i++)
    if (g_strcmp0 (((const LaminaSummary *) self->results->pdata[i])->id, kept) == 0)
      {
        lamina_job_add_dialog_choose (self, i);
        lamina_job_add_dialog_set_revision (self, kept_revision);
      }
  if (!isnan (max_u))
    filter = g_strdup_printf (_("%u constructions with U ≤ %s W/(m²·K)%s%s"), self->results->len,
                              lamina_format_u (u, max_u), element >= 0 ? _(", element: ") : "",
                              element >= 0 ? lamina_element_to_string ((LaminaElement) element) : "");
  else
    filter = g_strdup_printf (_("%u constructions (no target filter)"), self->results->len);
  gtk_label_set_text (self->filter_label, filter);
}

static void
on_filter_changed_cb (LaminaJobAddDialog *self)
{
  if (self->library != NULL)
    refresh (self);
}

gboolean
lamina_job_add_dialog_add (LaminaJobAddDialog  *self,
                           guint                index,
                           double               area,
                           GError             **error)
{
  const LaminaSummary *s;
  guint selected = gtk_drop_down_get_selected (self->use_dropdown);
  gboolean approved = FALSE;
  LaminaJobEntry *e;
  int revision;

  g_return_val_if_fail (index < self->results->len, FALSE);
  s = self->results->pdata[index];
  revision = lamina_library_pick_revision (self->library, s->id,
                                           g_strcmp0 (self->chosen_id, s->id) == 0
                                           ? lamina_job_add_dialog_get_revision (self) : 0,
                                           &approved, error);
  if (revision == 0)
    return FALSE;
  e = lamina_job_add_entry (self->job, lamina_job_entry_new (s->id, revision, self->uses[selected]));
  e->area = area;
  if (gtk_check_button_get_active (self->variant_check))
    {
      char *variant = lamina_library_derive_job_variant (self->library, s->id, revision, self->job->name,
                                                         NULL, error);

      if (variant == NULL)
        {
          lamina_job_remove_entry (self->job, e->n);
          return FALSE;
        }
      e->origin = g_steal_pointer (&e->construction);
      e->origin_revision = revision;
      e->construction = variant;
      e->revision = 1;
    }
  if (!lamina_library_save_job (self->library, self->job, error))
    {
      lamina_job_remove_entry (self->job, e->n);
      return FALSE;
    }
  gtk_window_destroy (GTK_WINDOW (self));
  return TRUE;
}

static void
on_add_clicked_cb (LaminaJobAddDialog *self)
{
  g_autoptr(GError) error = NULL;
  GtkListBoxRow *row = gtk_list_box_get_selected_row (self->result_list);
  const char *text = gtk_editable_get_text (GTK_EDITABLE (self->area_entry));
  double area = NAN;

  if (row == NULL)
    {
      gtk_label_set_text (self->error_label, _("Choose a construction in the list."));
      return;
    }
  if (*text && !lamina_number_parse (LAMINA_FIELD_AREA, text, &area, &error))
    {
      g_autofree char *message = g_strdup_printf (_("Area: %s"), error->message);

      gtk_label_set_text (self->error_label, message);
      return;
    }
  if (!lamina_job_add_dialog_add (self, (guint) gtk_list_box_row_get_index (row), area, &error))
    gtk_label_set_text (self->error_label, error->message);
}

void
lamina_job_add_dialog_set_use (LaminaJobAddDialog *self,
                               const char         *use)
{
  for (guint i = 0; use != NULL && self->uses[i] != NULL; i++)
    if (g_strcmp0 (self->uses[i], use) == 0)
      gtk_drop_down_set_selected (self->use_dropdown, i);
}

void
lamina_job_add_dialog_set_search (LaminaJobAddDialog *self,
                                  const char         *text)
{
  gtk_editable_set_text (GTK_EDITABLE (self->search_entry), text);
  refresh (self);
}

static void
lamina_job_add_dialog_dispose (GObject *object)
{
  LaminaJobAddDialog *self = LAMINA_JOB_ADD_DIALOG (object);

  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_JOB_ADD_DIALOG);
  g_clear_object (&self->library);
  G_OBJECT_CLASS (lamina_job_add_dialog_parent_class)->dispose (object);
}

static void
lamina_job_add_dialog_finalize (GObject *object)
{
  LaminaJobAddDialog *self = LAMINA_JOB_ADD_DIALOG (object);

  g_clear_pointer (&self->job, lamina_job_free);
  g_clear_pointer (&self->targets, lamina_target_set_free);
  g_clear_pointer (&self->uses, g_strfreev);
  g_clear_pointer (&self->results, g_ptr_array_unref);
  g_clear_pointer (&self->chosen_id, g_free);
  g_clear_pointer (&self->revisions, g_array_unref);
  g_clear_pointer (&self->approved, g_array_unref);
  G_OBJECT_CLASS (lamina_job_add_dialog_parent_class)->finalize (object);
}

static void
lamina_job_add_dialog_class_init (LaminaJobAddDialogClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_job_add_dialog_dispose;
  object_class->finalize = lamina_job_add_dialog_finalize;
  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-job-add-dialog.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaJobAddDialog, use_dropdown);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobAddDialog, search_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobAddDialog, meets_check);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobAddDialog, filter_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobAddDialog, result_list);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobAddDialog, area_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobAddDialog, variant_check);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobAddDialog, error_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobAddDialog, revision_dropdown);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobAddDialog, revision_note);
  gtk_widget_class_bind_template_callback (widget_class, on_row_selected_cb);
  gtk_widget_class_bind_template_callback (widget_class, on_revision_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, on_filter_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, on_add_clicked_cb);
  gtk_widget_class_bind_template_callback (widget_class, gtk_window_destroy);
}

static void
lamina_job_add_dialog_init (LaminaJobAddDialog *self)
{
  self->revisions = g_array_new (FALSE, FALSE, sizeof (int));
  self->approved = g_array_new (FALSE, FALSE, sizeof (gboolean));
  gtk_widget_init_template (GTK_WIDGET (self));
}

LaminaJobAddDialog *
lamina_job_add_dialog_new (GtkWindow             *parent,
                           LaminaLibrary         *library,
                           const LaminaJob       *job,
                           const LaminaTargetSet *targets)
{
  LaminaJobAddDialog *self = g_object_new (LAMINA_TYPE_JOB_ADD_DIALOG, "transient-for", parent, NULL);
  g_autoptr(GStrvBuilder) uses = g_strv_builder_new ();
  g_autoptr(GtkStringList) labels = gtk_string_list_new (NULL);

  self->library = g_object_ref (library);
  self->job = lamina_job_copy (job);
  self->targets = targets ? lamina_target_set_copy (targets) : NULL;
  for (guint i = 0; targets != NULL && i < targets->targets->len; i++)
    {
      const LaminaTarget *t = targets->targets->pdata[i];

      g_strv_builder_add (uses, t->use);
      gtk_string_list_append (labels, t->label ? t->label : t->use);
    }
  if (targets == NULL || targets->targets->len == 0)
    for (guint i = 0; default_uses[i] != NULL; i++)
      {
        g_strv_builder_add (uses, default_uses[i]);
        gtk_string_list_append (labels, default_uses[i]);
      }
  self->uses = g_strv_builder_end (uses);
  gtk_drop_down_set_model (self->use_dropdown, G_LIST_MODEL (labels));
  refresh (self);
  return self;
}
