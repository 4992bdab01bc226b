/* SPDX-License-Identifier: GPL-3.0-or-later */
/* LaminaJobsPage: the jobs of the library and one job — its data, its
 * schedule checked against its targets (met / not met and every flag at a
 * glance), adding from the library, moving an entry to a newer approved
 * revision (recorded), removing an entry, and the sheet set as PDF. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-jobs-page.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-job-dialog.h"
#include "lamina-job-entry-dialog.h"
#include "lamina-job-junction-dialog.h"
#include "lamina-job-sheets.h"
#include "lamina-revision-diff.h"
#include "lamina-library-safety.h"
#include "lamina-target-set-dialog.h"
#include "lamina-settings.h"
#include "lamina-sheet.h"
#include "lamina-sheet-format.h"

struct _LaminaJobsPage
{
  GtkBox           parent_instance;

  /* template */
  GtkListBox      *job_list;
  GtkStack        *detail_stack;
  GtkLabel        *title_label;
  GtkGrid         *data_grid;
  GtkLabel        *summary_label;
  GtkListBox      *schedule_list;
  GtkListBox      *junction_list;
  GtkLabel        *totals_label;
  GtkLabel        *status_label;

  /* owned */
  LaminaLibrary   *library;
  GPtrArray       *jobs;          /* LaminaJob* */
  LaminaJobReport *report;        /* the selected job, checked */
  GSettings       *settings;
  gboolean         filling;
  int              print_entry;   /* what the open chooser exports: 0 the set, else entry n */
};

G_DEFINE_FINAL_TYPE (LaminaJobsPage, lamina_jobs_page, GTK_TYPE_BOX)

static void show_job (LaminaJobsPage *self, const char *id);

/* The job list */

static GtkWidget *
create_job_row (const LaminaJob *job)
{
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 2);
  GtkWidget *top = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 8);
  GtkWidget *number = gtk_label_new (job->number ? job->number : job->id);
  GtkWidget *status = gtk_label_new (lamina_job_status_to_string (job->status));
  GtkWidget *name = gtk_label_new (job->name);

  gtk_widget_add_css_class (number, "lamina-row-code");
  gtk_widget_set_hexpand (number, TRUE);
  gtk_label_set_xalign (GTK_LABEL (number), 0);
  gtk_widget_add_css_class (status, "dim-label");
  gtk_label_set_xalign (GTK_LABEL (name), 0);
  gtk_label_set_ellipsize (GTK_LABEL (name), PANGO_ELLIPSIZE_END);
  gtk_box_append (GTK_BOX (top), number);
  gtk_box_append (GTK_BOX (top), status);
  gtk_box_append (GTK_BOX (box), top);
  gtk_box_append (GTK_BOX (box), name);
  gtk_widget_add_css_class (box, "lamina-library-row");
  return box;
}

void
lamina_jobs_page_reload (LaminaJobsPage *self)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *selected = g_strdup (lamina_jobs_page_get_job_id (self));
  GtkWidget *child;

  g_return_if_fail (LAMINA_IS_JOBS_PAGE (self));
  if (self->library == NULL)
    return;
  g_clear_pointer (&self->jobs, g_ptr_array_unref);
  self->jobs = lamina_library_list_jobs (self->library, &error);
  if (self->jobs == NULL)
    {
      gtk_label_set_text (self->status_label, error->message);
      self->jobs = g_ptr_array_new ();
    }
  self->filling = TRUE;
  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->job_list))) != NULL)
    gtk_list_box_remove (self->job_list, child);
  for (guint i = 0; i < self->jobs->len; i++)
    gtk_list_box_append (self->job_list, create_job_row (self->jobs->pdata[i]));
  self->filling = FALSE;
  if (selected == NULL || !lamina_jobs_page_select (self, selected))
    show_job (self, NULL);
}

gboolean
lamina_jobs_page_select (LaminaJobsPage *self,
                         const char     *id)
{
  for (guint i = 0; self->jobs != NULL && i < self->jobs->len; i++)
    if (g_strcmp0 (((LaminaJob *) self->jobs->pdata[i])->id, id) == 0)
      {
        self->filling = TRUE;
        gtk_list_box_select_row (self->job_list, gtk_list_box_get_row_at_index (self->job_list, (int) i));
        self->filling = FALSE;
        show_job (self, id);
        return TRUE;
      }
  return FALSE;
}

static void
on_job_selected_cb (LaminaJobsPage *self,
                    GtkListBoxRow  *row)
{
  if (self->filling)
    return;
  show_job (self, row != NULL
            ? ((LaminaJob *) self->jobs->pdata[gtk_list_box_row_get_index (row)])->id : NULL);
}

/* The job's data */

static void
add_field (LaminaJobsPage *self,
           int             row,
           const char     *label,
           const char     *value)
{
  GtkWidget *l = gtk_label_new (label);
  GtkWidget *v = gtk_label_new (value && *value ? value : "—");

  gtk_label_set_xalign (GTK_LABEL (l), 0);
  gtk_widget_add_css_class (l, "dim-label");
  gtk_label_set_xalign (GTK_LABEL (v), 0);
  gtk_label_set_wrap (GTK_LABEL (v), TRUE);
  gtk_label_set_selectable (GTK_LABEL (v), TRUE);
  gtk_grid_attach (self->data_grid, l, 0, row, 1, 1);
  gtk_grid_attach (self->data_grid, v, 1, row, 1, 1);
}

static void
fill_data (LaminaJobsPage *self)
{
  const LaminaJob *job = self->report->job;
  char inside[LAMINA_FORMAT_SIZE], outside[LAMINA_FORMAT_SIZE];
  g_autofree char *conditions = g_strdup_printf (_("inside %s, outside %s"),
                                                 lamina_format_temperature (inside, job->inside_temperature),
                                                 lamina_format_temperature (outside, job->outside_temperature));
  GtkWidget *child;
  int row = 0;

  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->data_grid))) != NULL)
    gtk_grid_remove (self->data_grid, child);
  gtk_label_set_text (self->title_label, job->name);
  add_field (self, row++, _("Number"), job->number);
  add_field (self, row++, _("Client"), job->client);
  add_field (self, row++, _("Site"), job->site);
  add_field (self, row++, _("Architect"), job->architect);
  add_field (self, row++, _("Status"), lamina_job_status_to_string (job->status));
  add_field (self, row++, _("Design conditions"), conditions);
  if (self->report->climate_unknown)
    {
      g_autofree char *flag = g_strdup_printf (_("⚠ “%s” is not among the library's climates: "
                                                 "moisture checks use each construction's own climate"),
                                               job->climate);

      add_field (self, row++, _("Climate"), flag);
      gtk_widget_add_css_class (gtk_grid_get_child_at (self->data_grid, 1, row - 1), "not-met");
    }
  else
    add_field (self, row++, _("Climate"), self->report->climate ? self->report->climate->name : job->climate);
  /* The set's name, then where its values come from: each once. */
  add_field (self, row++, _("Targets"), self->report->targets ? self->report->targets->name : _("none set"));
  if (self->report->targets != NULL && self->report->targets->source != NULL)
    add_field (self, row++, _("Source of targets"), self->report->targets->source);
}

/* The schedule */

typedef struct
{
  LaminaJobsPage *page;
  int             entry;
  int             revision;   /* for a move */
} RowAction;

static void
on_move_clicked_cb (GtkButton *button,
                    RowAction *action)
{
  LaminaJobsPage *self = action->page;
  g_autoptr(GError) error = NULL;
  g_autofree char *id = g_strdup (lamina_jobs_page_get_job_id (self));

  if (!lamina_library_move_job_entry (self->library, id, action->entry, action->revision, NULL, &error))
    gtk_label_set_text (self->status_label, error->message);
  show_job (self, id);
}

static void choose_pdf (LaminaJobsPage *self, int n);

static void
on_sheet_clicked_cb (GtkButton *button,
                     RowAction *action)
{
  choose_pdf (action->page, action->entry);
}

static void
on_remove_clicked_cb (GtkButton *button,
                      RowAction *action)
{
  LaminaJobsPage *self = action->page;
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaJob) job = lamina_job_copy (self->report->job);

  lamina_job_remove_entry (job, action->entry);
  if (!lamina_library_save_job (self->library, job, &error))
    gtk_label_set_text (self->status_label, error->message);
  show_job (self, job->id);
}

static void
on_edit_entry_clicked_cb (GtkButton *button,
                          RowAction *action)
{
  lamina_jobs_page_open_entry_dialog (action->page, action->entry);
}

static void
on_edit_junction_clicked_cb (GtkButton *button,
                             RowAction *action)
{
  lamina_jobs_page_open_junction_dialog (action->page, action->entry);
}

static void
on_remove_junction_clicked_cb (GtkButton *button,
                               RowAction *action)
{
  LaminaJobsPage *self = action->page;
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaJob) job = lamina_job_copy (self->report->job);

  lamina_job_remove_junction (job, action->entry);
  if (!lamina_library_save_job (self->library, job, &error))
    gtk_label_set_text (self->status_label, error->message);
  show_job (self, job->id);
}

static GtkWidget *
connect_row_action (LaminaJobsPage *self,
                    GtkWidget      *button,
                    int             entry,
                    int             revision,
                    GCallback       callback)
{
  RowAction *action = g_new0 (RowAction, 1);

  *action = (RowAction) { self, entry, revision };
  gtk_widget_add_css_class (button, "flat");
  /* A read-only library's jobs print but do not change. */
  gtk_widget_set_sensitive (button, callback == G_CALLBACK (on_sheet_clicked_cb)
                                    || !lamina_library_is_read_only (self->library));
  g_signal_connect_data (button, "clicked", callback, action, (GClosureNotify) (void (*) (void)) g_free, 0);
  return button;
}

static GtkWidget *
create_action_button (LaminaJobsPage *self,
                      const char     *label,
                      int             entry,
                      int             revision,
                      GCallback       callback)
{
  return connect_row_action (self, gtk_button_new_with_label (label), entry, revision, callback);
}

/* An icon button named by @tooltip: the rows stay narrow enough for the
 * figures. */
static GtkWidget *
create_icon_button (LaminaJobsPage *self,
                    const char     *icon,
                    const char     *tooltip,
                    int             entry,
                    GCallback       callback)
{
  GtkWidget *button = gtk_button_new_from_icon_name (icon);

  gtk_widget_set_tooltip_text (button, tooltip);
  return connect_row_action (self, button, entry, 0, callback);
}

static GtkWidget *
create_label (const char *text,
              int         chars,
              float       xalign)
{
  GtkWidget *label = gtk_label_new (text);

  gtk_label_set_width_chars (GTK_LABEL (label), chars);
  gtk_label_set_xalign (GTK_LABEL (label), xalign);
  return label;
}

static const char *
verdict_text (LaminaVerdict verdict)
{
  switch (verdict)
    {
    case LAMINA_VERDICT_MET:
      return _("✓ met");
    case LAMINA_VERDICT_NOT_MET:
      return _("✗ not met");
    case LAMINA_VERDICT_NO_TARGET:
      return _("no target");
    case LAMINA_VERDICT_NOT_CALCULATED:
    case LAMINA_N_VERDICTS:
    default:
      return _("not calculated");
    }
}

static const LaminaJobLine *
find_line (LaminaJobsPage *self,
           int             n)
{
  for (guint i = 0; self->report != NULL && i < self->report->check->lines->len; i++)
    if (((const LaminaJobLine *) self->report->check->lines->pdata[i])->entry->n == n)
      return self->report->check->lines->pdata[i];
  return NULL;
}

GPtrArray *
lamina_jobs_page_dup_differences (LaminaJobsPage *self,
                                  int             n)
{
  const LaminaJobLine *line = find_line (self, n);

  return line != NULL ? lamina_revision_diff_job_entry (self->library, line->entry) : NULL;
}

static GtkWidget *
create_schedule_row (LaminaJobsPage      *self,
                     const LaminaJobLine *line)
{
  const LaminaConstruction *c = line->construction;
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 2);
  GtkWidget *top = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 10);
  GtkWidget *name, *verdict;
  char u[LAMINA_FORMAT_SIZE], max[LAMINA_FORMAT_SIZE], area[LAMINA_FORMAT_SIZE], ua[LAMINA_FORMAT_SIZE];
  g_autofree char *title = g_strdup_printf ("%s%s%s", c ? c->name : line->entry->construction,
                                            line->entry->location ? " — " : "",
                                            line->entry->location ? line->entry->location : "");
  g_autofree char *code = g_strdup_printf ("%s r%d", c && c->code ? c->code : line->entry->construction,
                                           line->entry->revision);
  g_autofree char *moisture = lamina_job_line_dup_moisture_text (line);
  g_autofree char *variant = lamina_revision_diff_dup_variant_text (self->library, line->entry);

  gtk_box_append (GTK_BOX (top), create_label (code, 10, 0));
  gtk_widget_add_css_class (gtk_widget_get_last_child (top), "lamina-row-code");
  name = create_label (title, 10, 0);
  gtk_widget_set_hexpand (name, TRUE);
  gtk_label_set_ellipsize (GTK_LABEL (name), PANGO_ELLIPSIZE_END);
  gtk_box_append (GTK_BOX (top), name);
  gtk_box_append (GTK_BOX (top), create_label (line->entry->use, 16, 0));
  gtk_box_append (GTK_BOX (top), create_label (isnan (line->u) ? "—" : lamina_format_fixed (u, line->u, 3), 6, 1));
  gtk_box_append (GTK_BOX (top), create_label (isnan (line->max_u) ? "—" : lamina_format_fixed (max, line->max_u, 3), 6, 1));
  verdict = create_label (verdict_text (line->verdict), 11, 0);
  gtk_widget_add_css_class (verdict, "lamina-target");
  if (line->verdict == LAMINA_VERDICT_MET || line->verdict == LAMINA_VERDICT_NOT_MET)
    gtk_widget_add_css_class (verdict, line->verdict == LAMINA_VERDICT_MET ? "met" : "not-met");
  gtk_box_append (GTK_BOX (top), verdict);
  gtk_box_append (GTK_BOX (top), create_label (isnan (line->entry->area) ? "—"
                                               : lamina_format_fixed (area, line->entry->area, 1), 7, 1));
  gtk_box_append (GTK_BOX (top), create_label (isnan (line->ua) ? "—" : lamina_format_fixed (ua, line->ua, 2), 7, 1));
  if (line->flags & LAMINA_ENTRY_NEWER_APPROVED)
    {
      g_autofree char *label = g_strdup_printf (_("Move to r%d"), line->newer_revision);

      gtk_box_append (GTK_BOX (top), create_action_button (self, label, line->entry->n, line->newer_revision,
                                                           G_CALLBACK (on_move_clicked_cb)));
    }
  if (c != NULL)
    gtk_box_append (GTK_BOX (top), create_icon_button (self, "document-print-symbolic", _("Export the entry's sheet…"), line->entry->n,
                                                         G_CALLBACK (on_sheet_clicked_cb)));
  gtk_box_append (GTK_BOX (top), create_icon_button (self, "document-edit-symbolic", _("Change the entry…"), line->entry->n,
                                                       G_CALLBACK (on_edit_entry_clicked_cb)));
  gtk_box_append (GTK_BOX (top), create_icon_button (self, "user-trash-symbolic", _("Remove the entry"), line->entry->n,
                                                       G_CALLBACK (on_remove_clicked_cb)));
  gtk_box_append (GTK_BOX (box), top);
  if (variant != NULL)
    {
      GtkWidget *label = create_label (variant, 0, 0);

      gtk_label_set_wrap (GTK_LABEL (label), TRUE);
      gtk_widget_add_css_class (label, "caption");
      gtk_box_append (GTK_BOX (box), label);
    }
  if (moisture != NULL)
    {
      GtkWidget *label = create_label (moisture, 0, 0);

      gtk_label_set_wrap (GTK_LABEL (label), TRUE);
      gtk_widget_add_css_class (label, "caption");
      if (line->moisture_verdict == LAMINA_VERDICT_NOT_MET || (line->flags & LAMINA_ENTRY_FRSI_NOT_MET))
        gtk_widget_add_css_class (label, "not-met");
      gtk_box_append (GTK_BOX (box), label);
    }
  for (guint i = 0; i < line->notes->len; i++)
    {
      g_autofree char *text = g_strdup_printf ("⚠ %s", (const char *) line->notes->pdata[i]);
      GtkWidget *note = create_label (text, 0, 0);

      gtk_label_set_wrap (GTK_LABEL (note), TRUE);
      gtk_widget_add_css_class (note, "dim-label");
      gtk_widget_add_css_class (note, "caption");
      gtk_box_append (GTK_BOX (box), note);
    }
  gtk_widget_set_margin_start (box, 8);
  gtk_widget_set_margin_end (box, 8);
  gtk_widget_set_margin_top (box, 4);
  gtk_widget_set_margin_bottom (box, 4);
  return box;
}

static GtkWidget *create_label (const char *text, int chars, float xalign);

static GtkWidget *
create_junction_row (LaminaJobsPage          *self,
                     const LaminaJobJunction *j)
{
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 10);
  GtkWidget *name = create_label (j->name, 10, 0);
  char psi[LAMINA_FORMAT_SIZE], length[LAMINA_FORMAT_SIZE], psi_l[LAMINA_FORMAT_SIZE];
  g_autofree char *figures = g_strdup_printf (_("ψ %s W/(m·K) × %s m = %s W/K"),
                                              lamina_format_fixed (psi, j->psi, 3),
                                              lamina_format_fixed (length, j->length, 1),
                                              lamina_format_fixed (psi_l, j->psi * j->length, 2));

  gtk_widget_set_hexpand (name, TRUE);
  gtk_label_set_ellipsize (GTK_LABEL (name), PANGO_ELLIPSIZE_END);
  gtk_box_append (GTK_BOX (box), name);
  gtk_box_append (GTK_BOX (box), create_label (figures, 0, 1));
  gtk_box_append (GTK_BOX (box), create_icon_button (self, "document-edit-symbolic", _("Change the junction…"), j->n,
                                                       G_CALLBACK (on_edit_junction_clicked_cb)));
  gtk_box_append (GTK_BOX (box), create_icon_button (self, "user-trash-symbolic", _("Remove the junction"), j->n,
                                                       G_CALLBACK (on_remove_junction_clicked_cb)));
  gtk_widget_set_margin_start (box, 8);
  gtk_widget_set_margin_end (box, 8);
  return box;
}

static void
fill_junctions (LaminaJobsPage *self)
{
  const LaminaJob *job = self->report->job;
  GtkWidget *child;

  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->junction_list))) != NULL)
    gtk_list_box_remove (self->junction_list, child);
  for (guint i = 0; i < job->junctions->len; i++)
    gtk_list_box_append (self->junction_list, create_junction_row (self, job->junctions->pdata[i]));
  gtk_widget_set_visible (GTK_WIDGET (self->junction_list), job->junctions->len > 0);
}

static char *
dup_totals (const LaminaJobReport *report)
{
  const LaminaJobCheck *check = report->check;
  GString *text = g_string_new (NULL);
  char h[LAMINA_FORMAT_SIZE], a[LAMINA_FORMAT_SIZE], u[LAMINA_FORMAT_SIZE];

  g_string_append_printf (text, _("H_T = Σ U·A = %s W/K over %s m² — the fabric of the listed elements only"),
                          lamina_format_fixed (h, check->h_t, 2), lamina_format_fixed (a, check->area, 1));
  for (guint k = 0; k < LAMINA_N_ELEMENTS; k++)
    if (check->kinds[k].area > 0)
      g_string_append_printf (text, _("\n%s: area-weighted mean U %s W/(m²·K) over %s m²"),
                              lamina_element_to_string ((LaminaElement) k),
                              lamina_format_fixed (u, check->kinds[k].mean_u, 3),
                              lamina_format_fixed (a, check->kinds[k].area, 1));
  if (report->job->junctions->len > 0)
    g_string_append_printf (text, _("\nLinear thermal bridges entered by hand: Σ ψ·l = %s W/K; with them %s W/K"),
                            lamina_format_fixed (h, check->h_junctions, 2),
                            lamina_format_fixed (a, check->h_total, 2));
  return g_string_free (text, FALSE);
}

static char *
dup_summary (const LaminaJobCheck *check)
{
  if (check->lines->len == 0)
    return g_strdup (_("The schedule is empty: add constructions from the library."));
  if (check->n_not_met == 0 && check->n_open == 0)
    return g_strdup_printf (_("✓ All %u entries meet their targets (%u with notes to read)."),
                            check->lines->len, check->n_flagged);
  return g_strdup_printf (_("✗ %u of %u entries meet their targets: %u not met, %u without a target or figure."),
                          check->n_met, check->lines->len, check->n_not_met, check->n_open);
}

/* The actions that need a job shown. */
static void
set_job_actions_enabled (LaminaJobsPage *self,
                         gboolean        enabled)
{
  static const char *const names[] = {
    "jobs.add-entry", "jobs.print", "jobs.edit-job", "jobs.add-junction", "jobs.delete-job",
  };
  gboolean writable = self->library != NULL && !lamina_library_is_read_only (self->library);

  for (guint i = 0; i < G_N_ELEMENTS (names); i++)
    gtk_widget_action_set_enabled (GTK_WIDGET (self), names[i],
                                   enabled && (writable || g_str_equal (names[i], "jobs.print")));
}

static void
show_job (LaminaJobsPage *self,
          const char     *id)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *summary = NULL, *totals = NULL;
  GtkWidget *child;

  g_clear_pointer (&self->report, lamina_job_report_free);
  set_job_actions_enabled (self, FALSE);
  if (id == NULL)
    {
      gtk_stack_set_visible_child_name (self->detail_stack, "empty");
      return;
    }
  self->report = lamina_library_check_job (self->library, id, &error);
  if (self->report == NULL)
    {
      gtk_label_set_text (self->status_label, error->message);
      gtk_stack_set_visible_child_name (self->detail_stack, "empty");
      return;
    }
  fill_data (self);
  summary = dup_summary (self->report->check);
  gtk_label_set_text (self->summary_label, summary);
  gtk_widget_remove_css_class (GTK_WIDGET (self->summary_label), "met");
  gtk_widget_remove_css_class (GTK_WIDGET (self->summary_label), "not-met");
  gtk_widget_add_css_class (GTK_WIDGET (self->summary_label),
                            self->report->check->n_not_met > 0 ? "not-met" : "met");
  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->schedule_list))) != NULL)
    gtk_list_box_remove (self->schedule_list, child);
  for (guint i = 0; i < self->report->check->lines->len; i++)
    gtk_list_box_append (self->schedule_list, create_schedule_row (self, self->report->check->lines->pdata[i]));
  fill_junctions (self);
  totals = dup_totals (self->report);
  gtk_label_set_text (self->totals_label, totals);
  gtk_stack_set_visible_child_name (self->detail_stack, "job");
  set_job_actions_enabled (self, TRUE);
}

const char *
lamina_jobs_page_get_job_id (LaminaJobsPage *self)
{
  return self->report != NULL ? self->report->job->id : NULL;
}

const char *
lamina_jobs_page_get_summary (LaminaJobsPage *self)
{
  return gtk_label_get_text (self->summary_label);
}

guint
lamina_jobs_page_get_n_entries (LaminaJobsPage *self)
{
  return self->report != NULL ? self->report->check->lines->len : 0;
}

/* Adding */

static void
on_add_dialog_destroyed_cb (LaminaJobsPage *self)
{
  g_autofree char *id = g_strdup (lamina_jobs_page_get_job_id (self));

  if (id != NULL)
    show_job (self, id);
}

LaminaJobAddDialog *
lamina_jobs_page_open_add_dialog (LaminaJobsPage *self,
                                  const char     *use)
{
  LaminaJobAddDialog *dialog;

  g_return_val_if_fail (self->report != NULL, NULL);
  dialog = lamina_job_add_dialog_new (GTK_WINDOW (gtk_widget_get_root (GTK_WIDGET (self))),
                                      self->library, self->report->job, self->report->targets);
  lamina_job_add_dialog_set_use (dialog, use);
  g_signal_connect_object (dialog, "destroy", G_CALLBACK (on_add_dialog_destroyed_cb), self,
                           G_CONNECT_SWAPPED);
  gtk_window_present (GTK_WINDOW (dialog));
  return dialog;
}

static void
add_entry_action (GtkWidget  *widget,
                  const char *name,
                  GVariant   *parameter)
{
  lamina_jobs_page_open_add_dialog (LAMINA_JOBS_PAGE (widget), NULL);
}

/* Editing: each dialog stores what it changes and says so by "saved". */

static void
on_saved_cb (LaminaJobsPage *self,
             const char     *id)
{
  lamina_jobs_page_reload (self);
  lamina_jobs_page_select (self, id);
}

static GtkWindow *
get_parent (LaminaJobsPage *self)
{
  return GTK_WINDOW (gtk_widget_get_root (GTK_WIDGET (self)));
}

static void
present (LaminaJobsPage *self,
         gpointer        dialog)
{
  g_signal_connect_object (dialog, "saved", G_CALLBACK (on_saved_cb), self, G_CONNECT_SWAPPED);
  gtk_window_present (GTK_WINDOW (dialog));
}

LaminaJobDialog *
lamina_jobs_page_open_job_dialog (LaminaJobsPage *self,
                                  gboolean        new_job)
{
  LaminaJobDialog *dialog;

  g_return_val_if_fail (new_job || self->report != NULL, NULL);
  dialog = lamina_job_dialog_new (get_parent (self), self->library, new_job ? NULL : self->report->job);
  present (self, dialog);
  return dialog;
}

LaminaJobEntryDialog *
lamina_jobs_page_open_entry_dialog (LaminaJobsPage *self,
                                    int             n)
{
  g_autoptr(GError) error = NULL;
  LaminaJobEntryDialog *dialog;

  g_return_val_if_fail (self->report != NULL, NULL);
  dialog = lamina_job_entry_dialog_new (get_parent (self), self->library, self->report->job->id, n, &error);
  if (dialog == NULL)
    {
      gtk_label_set_text (self->status_label, error->message);
      return NULL;
    }
  present (self, dialog);
  return dialog;
}

LaminaJobJunctionDialog *
lamina_jobs_page_open_junction_dialog (LaminaJobsPage *self,
                                       int             n)
{
  g_autoptr(GError) error = NULL;
  LaminaJobJunctionDialog *dialog;

  g_return_val_if_fail (self->report != NULL, NULL);
  dialog = lamina_job_junction_dialog_new (get_parent (self), self->library, self->report->job->id, n, &error);
  if (dialog == NULL)
    {
      gtk_label_set_text (self->status_label, error->message);
      return NULL;
    }
  present (self, dialog);
  return dialog;
}

static void
on_job_deleted_cb (LaminaJobsPage *self,
                   const char     *id)
{
  g_autofree char *message = g_strdup_printf (_("Job “%s” deleted."), id);

  lamina_jobs_page_reload (self);
  gtk_label_set_text (self->status_label, message);
}

LaminaJobDeleteDialog *
lamina_jobs_page_open_delete_dialog (LaminaJobsPage *self)
{
  LaminaJobDeleteDialog *dialog;

  g_return_val_if_fail (self->report != NULL, NULL);
  dialog = lamina_job_delete_dialog_new (get_parent (self), self->library, self->report->job);
  g_signal_connect_object (dialog, "deleted", G_CALLBACK (on_job_deleted_cb), self, G_CONNECT_SWAPPED);
  gtk_window_present (GTK_WINDOW (dialog));
  return dialog;
}

static void
delete_job_action (GtkWidget  *widget,
                   const char *name,
                   GVariant   *parameter)
{
  lamina_jobs_page_open_delete_dialog (LAMINA_JOBS_PAGE (widget));
}

static void
on_targets_saved_cb (LaminaJobsPage *self)
{
  g_autofree char *id = g_strdup (lamina_jobs_page_get_job_id (self));

  if (id != NULL)
    show_job (self, id);
}

LaminaTargetSetDialog *
lamina_jobs_page_open_target_sets (LaminaJobsPage *self)
{
  LaminaTargetSetDialog *dialog;

  dialog = lamina_target_set_dialog_new (get_parent (self), self->library,
                                         self->report != NULL ? self->report->job->target_set : NULL);
  g_signal_connect_object (dialog, "saved", G_CALLBACK (on_targets_saved_cb), self, G_CONNECT_SWAPPED);
  gtk_window_present (GTK_WINDOW (dialog));
  return dialog;
}

static void
target_sets_action (GtkWidget  *widget,
                    const char *name,
                    GVariant   *parameter)
{
  lamina_jobs_page_open_target_sets (LAMINA_JOBS_PAGE (widget));
}

static void
new_job_action (GtkWidget  *widget,
                const char *name,
                GVariant   *parameter)
{
  lamina_jobs_page_open_job_dialog (LAMINA_JOBS_PAGE (widget), TRUE);
}

static void
edit_job_action (GtkWidget  *widget,
                 const char *name,
                 GVariant   *parameter)
{
  lamina_jobs_page_open_job_dialog (LAMINA_JOBS_PAGE (widget), FALSE);
}

static void
add_junction_action (GtkWidget  *widget,
                     const char *name,
                     GVariant   *parameter)
{
  lamina_jobs_page_open_junction_dialog (LAMINA_JOBS_PAGE (widget), 0);
}

/* Sheets */

char *
lamina_jobs_page_dup_uses_text (LaminaJobsPage *self,
                                const char     *construction_id)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) uses = lamina_library_list_job_uses (self->library, construction_id, &error);
  GString *text;

  if (uses == NULL)
    return g_strdup (error->message);
  if (uses->len == 0)
    return g_strdup (_("No job uses this construction."));
  text = g_string_new (_("Used in"));
  for (guint i = 0; i < uses->len; i++)
    {
      const LaminaJobUse *use = uses->pdata[i];

      g_string_append_printf (text, _("%s %s %s (entry %d, revision %d, %s)"), i > 0 ? ";" : "",
                              use->job_number ? use->job_number : use->job_id, use->job_name,
                              use->entry, use->revision, use->use);
    }
  g_string_append_c (text, '.');
  return g_string_free (text, FALSE);
}

static void
init_options (LaminaJobsPage     *self,
              LaminaSheetOptions *options,
              char              **practice)
{
  lamina_sheet_options_init (options);
  *practice = g_settings_get_string (self->settings, "practice-name");
  options->practice = **practice ? *practice : NULL;
  options->library = lamina_library_get_path (self->library);
  options->moisture_limit = lamina_library_get_moisture_limit (self->library);
}

gboolean
lamina_jobs_page_export_entry (LaminaJobsPage  *self,
                               int              n,
                               const char      *path,
                               GError         **error)
{
  g_autofree char *practice = NULL;
  const LaminaJobLine *line = find_line (self, n);
  LaminaSheetOptions options;

  g_return_val_if_fail (self->report != NULL, FALSE);
  if (line == NULL || line->construction == NULL)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                   _("Entry %d has no construction to print."), n);
      return FALSE;
    }
  init_options (self, &options, &practice);
  return lamina_sheet_write_job_entry (path, TRUE, &options, self->report->job, line, error);
}

/* The sheet set */

gboolean
lamina_jobs_page_export (LaminaJobsPage  *self,
                         const char      *path,
                         GError         **error)
{
  g_autofree char *practice = NULL;
  g_autoptr(LaminaJobReport) report = NULL;
  LaminaSheetOptions options;

  g_return_val_if_fail (self->report != NULL, FALSE);
  init_options (self, &options, &practice);
  /* A fresh check of its own: the variants' notes go on the sheets only. */
  report = lamina_library_check_job (self->library, self->report->job->id, error);
  if (report == NULL)
    return FALSE;
  lamina_revision_diff_note_variants (self->library, report);
  return lamina_sheet_write_job (path, TRUE, &options, report->job, report->targets,
                                 report->check, error);
}

typedef struct
{
  LaminaJobsPage *page;
  char           *path;
} SetWrite;

static void
on_set_written_cb (GObject      *source,
                   GAsyncResult *result,
                   gpointer      user_data)
{
  SetWrite *write = user_data;
  g_autoptr(GError) error = NULL;
  g_autofree char *message = NULL;

  if (lamina_job_sheets_write_finish (result, &error))
    message = g_strdup_printf (_("Written to %s"), write->path);
  else if (g_error_matches (error, G_IO_ERROR, G_IO_ERROR_CANCELLED))
    message = g_strdup (_("Sheet set cancelled; nothing was written"));
  if (write->page->status_label != NULL)   /* not closed meanwhile */
    gtk_label_set_text (write->page->status_label, message ? message : error->message);
  g_object_unref (write->page);
  g_free (write->path);
  g_free (write);
}

void
lamina_jobs_page_export_in_worker (LaminaJobsPage *self,
                                   const char     *path,
                                   GCancellable   *cancellable)
{
  g_autofree char *practice = g_settings_get_string (self->settings, "practice-name");
  SetWrite *write = g_new0 (SetWrite, 1);

  g_return_if_fail (self->report != NULL);
  write->page = g_object_ref (self);
  write->path = g_strdup (path);
  lamina_job_sheets_write_async (GTK_WINDOW (gtk_widget_get_root (GTK_WIDGET (self))), self->library,
                                 self->report->job->id, path, practice, cancellable,
                                 on_set_written_cb, write);
}

/* Entry 0 is the whole set, written in a worker with progress and Cancel. */
static void
on_print_response_cb (GtkNativeDialog *dialog,
                      int              response,
                      LaminaJobsPage  *self)
{
  int n = self->print_entry;

  if (response == GTK_RESPONSE_ACCEPT && self->report != NULL && n == 0)
    {
      g_autoptr(GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));
      g_autofree char *path = g_file_get_path (file);

      lamina_jobs_page_export_in_worker (self, path, NULL);
    }
  else if (response == GTK_RESPONSE_ACCEPT && self->report != NULL)
    {
      g_autoptr(GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));
      g_autofree char *path = g_file_get_path (file);
      g_autoptr(GError) error = NULL;
      g_autofree char *message = NULL;
      gboolean ok = lamina_jobs_page_export_entry (self, n, path, &error);

      if (ok)
        message = g_strdup_printf (_("Written to %s"), path);
      gtk_label_set_text (self->status_label, message ? message : error->message);
    }
  gtk_native_dialog_destroy (dialog);
  g_object_unref (dialog);
  g_object_unref (self);
}

static void
choose_pdf (LaminaJobsPage *self,
            int             n)
{
  GtkFileChooserNative *chooser;
  g_autofree char *suggested = NULL;

  if (self->report == NULL)
    return;
  suggested = n > 0
    ? g_strdup_printf ("%s-%d.pdf", self->report->job->number ? self->report->job->number : self->report->job->id, n)
    : g_strdup_printf ("%s.pdf", self->report->job->number ? self->report->job->number : self->report->job->id);
  g_strdelimit (suggested, "/\\:*?\"<>| ", '-');
  chooser = gtk_file_chooser_native_new (n > 0 ? _("Export the Entry’s Sheet") : _("Print the Job’s Sheet Set"),
                                         GTK_WINDOW (gtk_widget_get_root (GTK_WIDGET (self))),
                                         GTK_FILE_CHOOSER_ACTION_SAVE, _("_Export"), _("_Cancel"));
  gtk_file_chooser_set_current_name (GTK_FILE_CHOOSER (chooser), suggested);
  gtk_native_dialog_set_modal (GTK_NATIVE_DIALOG (chooser), TRUE);
  self->print_entry = n;
  g_signal_connect (chooser, "response", G_CALLBACK (on_print_response_cb), g_object_ref (self));
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (chooser));
}

static void
print_action (GtkWidget  *widget,
              const char *name,
              GVariant   *parameter)
{
  choose_pdf (LAMINA_JOBS_PAGE (widget), 0);
}

/* Life cycle */

static void
on_library_changed_cb (LaminaJobsPage *self)
{
  lamina_jobs_page_reload (self);
}

void
lamina_jobs_page_set_library (LaminaJobsPage *self,
                              LaminaLibrary  *library)
{
  g_return_if_fail (LAMINA_IS_JOBS_PAGE (self));
  g_return_if_fail (self->library == NULL);

  self->library = g_object_ref (library);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "jobs.new-job", !lamina_library_is_read_only (library));
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "jobs.target-sets", !lamina_library_is_read_only (library));
  g_signal_connect_object (library, "changed", G_CALLBACK (on_library_changed_cb), self, G_CONNECT_SWAPPED);
  lamina_jobs_page_reload (self);
}

static void
lamina_jobs_page_dispose (GObject *object)
{
  LaminaJobsPage *self = LAMINA_JOBS_PAGE (object);

  /* The list unselects its rows as it goes. */
  self->filling = TRUE;
  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_JOBS_PAGE);
  g_clear_object (&self->library);
  g_clear_object (&self->settings);
  G_OBJECT_CLASS (lamina_jobs_page_parent_class)->dispose (object);
}

static void
lamina_jobs_page_finalize (GObject *object)
{
  LaminaJobsPage *self = LAMINA_JOBS_PAGE (object);

  g_clear_pointer (&self->jobs, g_ptr_array_unref);
  g_clear_pointer (&self->report, lamina_job_report_free);
  G_OBJECT_CLASS (lamina_jobs_page_parent_class)->finalize (object);
}

static void
lamina_jobs_page_class_init (LaminaJobsPageClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_jobs_page_dispose;
  object_class->finalize = lamina_jobs_page_finalize;
  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-jobs-page.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaJobsPage, job_list);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobsPage, detail_stack);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobsPage, title_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobsPage, data_grid);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobsPage, summary_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobsPage, schedule_list);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobsPage, junction_list);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobsPage, totals_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobsPage, status_label);
  gtk_widget_class_bind_template_callback (widget_class, on_job_selected_cb);
  gtk_widget_class_install_action (widget_class, "jobs.add-entry", NULL, add_entry_action);
  gtk_widget_class_install_action (widget_class, "jobs.print", NULL, print_action);
  gtk_widget_class_install_action (widget_class, "jobs.new-job", NULL, new_job_action);
  gtk_widget_class_install_action (widget_class, "jobs.target-sets", NULL, target_sets_action);
  gtk_widget_class_install_action (widget_class, "jobs.edit-job", NULL, edit_job_action);
  gtk_widget_class_install_action (widget_class, "jobs.add-junction", NULL, add_junction_action);
  gtk_widget_class_install_action (widget_class, "jobs.delete-job", NULL, delete_job_action);
}

static void
lamina_jobs_page_init (LaminaJobsPage *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  self->settings = lamina_settings_new ();
  set_job_actions_enabled (self, FALSE);
}
