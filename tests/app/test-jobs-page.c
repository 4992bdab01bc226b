/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The Jobs view under Xvfb, on a copy of the demo library: switching
 * views, a job's compliance at a glance (the school's hall wall fails its
 * invented target), adding from the library with the target filter set
 * to the entry's use, printing the sheet set, and a PNG to look at. */
#include "config.h"

#include <glib/gstdio.h>
#include <gtk/gtk.h>
#include <math.h>
#include <string.h>

#include "lamina-application.h"
#include "lamina-demo.h"
#include "lamina-window.h"
#include "lamina-job-dialog-private.h"
#include "lamina-job-entry-dialog-private.h"
#include "lamina-job-junction-dialog-private.h"
#include "lamina-target-set-dialog-private.h"
#include "lamina-job-add-dialog-private.h"
#include "lamina-job-delete-dialog-private.h"
#include "lamina-app-test-util.h"

/* The first label under @widget whose text starts with @prefix. */
static const char *
find_label (GtkWidget  *widget,
            const char *prefix)
{
  if (GTK_IS_LABEL (widget) && g_str_has_prefix (gtk_label_get_text (GTK_LABEL (widget)), prefix))
    return gtk_label_get_text (GTK_LABEL (widget));
  for (GtkWidget *child = gtk_widget_get_first_child (widget); child != NULL;
       child = gtk_widget_get_next_sibling (child))
    {
      const char *found = find_label (child, prefix);

      if (found != NULL)
        return found;
    }
  return NULL;
}

static void
test_jobs_page (void)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *dir = g_dir_make_tmp ("lamina-jobs-XXXXXX", &error);
  g_autofree char *path = g_build_filename (dir, "library.sqlite", NULL);
  g_autofree char *pdf = g_build_filename (dir, "riverside.pdf", NULL);
  const char *build = g_getenv ("LAMINA_BUILD_DIR");
  g_autofree char *png = g_build_filename (build ? build : ".", "tests", "app", "jobs-page.png", NULL);
  g_autoptr(LaminaLibrary) library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  g_autofree char *data = NULL;
  g_autofree char *uses = NULL;
  LaminaWindow *window;
  LaminaJobsPage *page;
  LaminaJobAddDialog *dialog;
  GPtrArray *results;
  gsize length = 0;
  guint pick;

  g_assert_no_error (error);
  g_assert_true (lamina_demo_load (library, &error));
  lamina_application_load_style ();
  window = lamina_window_new (NULL, library);
  gtk_window_set_default_size (GTK_WINDOW (window), 1280, 800);
  gtk_window_present (GTK_WINDOW (window));
  lamina_window_show_view (window, "jobs");
  page = lamina_window_get_jobs_page (window);
  g_assert_true (lamina_jobs_page_select (page, "demo-job-riverside"));
  wait_for_draw (GTK_WIDGET (window));
  g_assert_cmpuint (lamina_jobs_page_get_n_entries (page), ==, 5);
  /* EW-203, U 0.326 over the invented 0.18 for external walls. */
  g_assert_nonnull (strstr (lamina_jobs_page_get_summary (page), "4 of 5 entries meet their targets: 1 not met"));
  /* The demo's invented external-wall target asks fRsi ≥ 0.75 and no
   * interstitial condensation (EN ISO 13788): EW-201 is assessed in the
   * job's climate and passes both; EW-203 has no moisture settings. */
  g_assert_nonnull (find_label (GTK_WIDGET (page), "EN ISO 13788: fRsi"));
  g_assert_nonnull (strstr (find_label (GTK_WIDGET (page), "EN ISO 13788: fRsi"),
                            "minimum 0.750: met; no interstitial condensation: met"));
  save_png (GTK_WIDGET (window), png);
  g_test_message ("jobs page rendered to %s", png);

  /* The filter follows the use: roofs up to the invented 0.15. */
  dialog = lamina_jobs_page_open_add_dialog (page, "roof");
  g_assert_cmpfloat (lamina_job_add_dialog_get_max_u (dialog), ==, 0.15);
  g_assert_cmpint (lamina_job_add_dialog_get_element (dialog), ==, LAMINA_ELEMENT_ROOF);
  results = lamina_job_add_dialog_get_results (dialog);
  g_assert_cmpuint (results->len, >, 0);
  for (guint i = 0; i < results->len; i++)
    {
      const LaminaSummary *s = results->pdata[i];

      g_assert_cmpfloat (s->u_corrected, <=, 0.15);
      g_assert_cmpint (s->element, ==, LAMINA_ELEMENT_ROOF);
    }
  lamina_job_add_dialog_set_use (dialog, "external-wall");
  g_assert_cmpfloat (lamina_job_add_dialog_get_max_u (dialog), ==, 0.18);
  lamina_job_add_dialog_set_search (dialog, "EW-101");
  results = lamina_job_add_dialog_get_results (dialog);
  pick = results->len;
  for (guint i = 0; i < results->len; i++)
    if (g_strcmp0 (((LaminaSummary *) results->pdata[i])->code, "EW-101") == 0)
      pick = i;
  g_assert_cmpuint (pick, <, results->len);
  g_assert_true (lamina_job_add_dialog_add (dialog, pick, 24, &error));
  g_assert_no_error (error);
  g_assert_cmpuint (lamina_jobs_page_get_n_entries (page), ==, 6);

  /* The same as a job variant: a copy of the approved revision 3,
   * linked to it; apart from its own name and code nothing differs
   * yet. */
  dialog = lamina_jobs_page_open_add_dialog (page, "external-wall");
  lamina_job_add_dialog_set_search (dialog, "EW-101");
  gtk_check_button_set_active (dialog->variant_check, TRUE);
  g_assert_true (lamina_job_add_dialog_add (dialog, pick, NAN, &error));
  g_assert_no_error (error);
  g_assert_cmpuint (lamina_jobs_page_get_n_entries (page), ==, 7);
  {
    g_autoptr(LaminaJob) job = lamina_library_dup_job (library, "demo-job-riverside", &error);
    const LaminaJobEntry *e = job->entries->pdata[6];
    g_autoptr(GPtrArray) differences = lamina_jobs_page_dup_differences (page, e->n);

    g_assert_cmpstr (e->origin, ==, "demo-ew-101");
    g_assert_cmpint (e->origin_revision, ==, 3);
    g_assert_cmpint (e->revision, ==, 1);
    g_assert_cmpuint (differences->len, ==, 0);
  }

  g_assert_true (lamina_jobs_page_export (page, pdf, &error));
  g_assert_no_error (error);
  g_assert_true (g_file_get_contents (pdf, &data, &length, NULL));
  g_assert_true (length > 1000 && memcmp (data, "%PDF", 4) == 0);
  g_clear_pointer (&data, g_free);

  /* One entry's sheet with the job's band; none for a missing number. */
  g_assert_true (lamina_jobs_page_export_entry (page, 2, pdf, &error));
  g_assert_no_error (error);
  g_assert_true (g_file_get_contents (pdf, &data, &length, NULL));
  g_assert_true (memcmp (data, "%PDF", 4) == 0);
  g_assert_false (lamina_jobs_page_export_entry (page, 99, pdf, &error));
  g_clear_error (&error);

  /* The library names the jobs using a construction. */
  uses = lamina_jobs_page_dup_uses_text (page, "demo-ew-203");
  g_assert_nonnull (strstr (uses, "TO-2402"));
  g_assert_nonnull (strstr (uses, "entry 2, revision 1, external-wall"));
  g_clear_pointer (&uses, g_free);
  uses = lamina_jobs_page_dup_uses_text (page, "demo-ew-302");
  g_assert_cmpstr (uses, ==, "No job uses this construction.");

  /* A job variant of EW-101 with 40 mm more wood fibre: the difference
   * from its origin's revision is shown. */
  {
    g_autofree char *variant_id = lamina_library_derive_construction (library, "demo-ew-101", NULL, &error);
    g_autoptr(LaminaConstruction) v = lamina_library_dup_construction (library, variant_id, 0, &error);
    g_autoptr(LaminaJob) job = lamina_library_dup_job (library, "demo-job-riverside", &error);
    g_autoptr(GPtrArray) differences = NULL;
    LaminaLayer *fibre = v->layers->pdata[4];
    LaminaJobEntry *e;

    fibre->thickness += 40;
    g_assert_true (lamina_library_save_construction (library, v, 1, NULL, &error));
    g_assert_no_error (error);
    e = lamina_job_add_entry (job, lamina_job_entry_new (variant_id, 2, "external-wall"));
    e->origin = g_strdup ("demo-ew-101");
    e->origin_revision = 3;
    g_assert_true (lamina_library_save_job (library, job, &error));
    g_assert_true (lamina_jobs_page_select (page, "demo-job-riverside"));
    differences = lamina_jobs_page_dup_differences (page, e->n);
    g_assert_nonnull (differences);
    g_assert_cmpuint (differences->len, >, 0);
    g_assert_null (lamina_jobs_page_dup_differences (page, 1));
  }

  lamina_window_show_view (window, "library");
  gtk_window_destroy (GTK_WINDOW (window));
  lamina_library_close (library);
  g_remove (pdf);
  g_remove (path);
  g_rmdir (dir);
}

static void
set_entry (GtkEntry   *entry,
           const char *text)
{
  gtk_editable_set_text (GTK_EDITABLE (entry), text);
}

/* Saving @dialog fails with a message that starts with @field (the field
 * is named) and the dialog stays open. */
#define assert_refused(save, dialog, field)                                \
  G_STMT_START {                                                           \
    g_autoptr(GError) refused = NULL;                                      \
    g_assert_false (save (dialog, &refused));                              \
    g_assert_nonnull (refused);                                            \
    if (!g_str_has_prefix (refused->message, field))                       \
      g_error ("“%s” does not name “%s”", refused->message, field);        \
  } G_STMT_END

static guint
find_choice (GtkDropDown *dropdown,
             const char  *text)
{
  GListModel *model = gtk_drop_down_get_model (dropdown);

  for (guint i = 0; i < g_list_model_get_n_items (model); i++)
    if (strstr (gtk_string_list_get_string (GTK_STRING_LIST (model), i), text) != NULL)
      return i;
  g_error ("no choice “%s”", text);
  return 0;
}

/* A window on a fresh copy of the demo library, showing the Jobs. */
typedef struct
{
  char          *dir;
  char          *path;
  LaminaLibrary *library;
  LaminaWindow  *window;
  LaminaJobsPage *page;
} DemoWindow;

static void
demo_window_open (DemoWindow *d)
{
  g_autoptr(GError) error = NULL;

  d->dir = g_dir_make_tmp ("lamina-jobs-XXXXXX", &error);
  g_assert_no_error (error);
  d->path = g_build_filename (d->dir, "library.sqlite", NULL);
  d->library = lamina_library_open (d->path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  g_assert_no_error (error);
  g_assert_true (lamina_demo_load (d->library, &error));
  lamina_application_load_style ();
  d->window = lamina_window_new (NULL, d->library);
  gtk_window_present (GTK_WINDOW (d->window));
  lamina_window_show_view (d->window, "jobs");
  d->page = lamina_window_get_jobs_page (d->window);
}

static void
demo_window_close (DemoWindow *d)
{
  gtk_window_destroy (GTK_WINDOW (d->window));
  lamina_library_close (d->library);
  g_clear_object (&d->library);
  g_remove (d->path);
  g_rmdir (d->dir);
  g_free (d->path);
  g_free (d->dir);
}

/* Creating and changing a job, one of its entries and a junction in the
 * window: each fault names its field and stores nothing; what is saved is
 * what the library holds.  B′ = A / (0.5 P) = 100 / 20 = 5 m
 * (EN ISO 13370:2017 8.1, equation 2). */
static void
test_jobs_edit (void)
{
  g_autoptr(GError) error = NULL;
  const char *build = g_getenv ("LAMINA_BUILD_DIR");
  g_autofree char *png = g_build_filename (build ? build : ".", "tests", "app", "job-dialog.png", NULL);
  g_autoptr(LaminaJob) job = NULL;
  DemoWindow d;
  LaminaLibrary *library;
  LaminaJobsPage *page;
  LaminaJobDialog *dialog;
  LaminaJobEntryDialog *entry_dialog;
  LaminaJobJunctionDialog *junction_dialog;
  const LaminaJobEntry *e;
  g_autofree char *draft_text = NULL;
  guint n_log;
  int draft = 0;

  demo_window_open (&d);
  library = d.library;
  page = d.page;

  /* A new job. */
  dialog = lamina_jobs_page_open_job_dialog (page, TRUE);
  set_entry (dialog->id_entry, "TO-2409");
  assert_refused (lamina_job_dialog_save, dialog, "Name:");
  g_assert_true (gtk_widget_has_css_class (GTK_WIDGET (dialog->name_entry), "error"));
  set_entry (dialog->name_entry, "Mill house (invented)");
  set_entry (dialog->inside_entry, "warm");
  assert_refused (lamina_job_dialog_save, dialog, "Inside design temperature:");
  set_entry (dialog->inside_entry, "21");
  set_entry (dialog->ground_area_entry, "100");
  assert_refused (lamina_job_dialog_save, dialog, "Exposed perimeter P:");
  set_entry (dialog->ground_perimeter_entry, "40");
  set_entry (dialog->client_entry, "  M. Miller  ");
  gtk_drop_down_set_selected (dialog->climate_dropdown, find_choice (dialog->climate_dropdown, "(fallowmere)"));
  gtk_drop_down_set_selected (dialog->targets_dropdown,
                              find_choice (dialog->targets_dropdown, "demo-fallowmere-rules"));
  gtk_drop_down_set_selected (dialog->status_dropdown, LAMINA_JOB_STATUS_SUBMITTED);
  wait_for_draw (GTK_WIDGET (dialog));
  save_png (GTK_WIDGET (dialog), png);
  g_assert_true (lamina_job_dialog_save (dialog, &error));
  g_assert_no_error (error);
  g_assert_cmpstr (lamina_jobs_page_get_job_id (page), ==, "TO-2409");
  job = lamina_library_dup_job (library, "TO-2409", &error);
  g_assert_cmpstr (job->client, ==, "M. Miller");
  g_assert_cmpstr (job->climate, ==, "fallowmere");
  g_assert_cmpstr (job->target_set, ==, "demo-fallowmere-rules");
  g_assert_cmpint (job->status, ==, LAMINA_JOB_STATUS_SUBMITTED);
  g_assert_cmpfloat (job->inside_temperature, ==, 21);
  g_assert_cmpfloat_with_epsilon (lamina_job_get_b_prime (job), 5.0, 1e-12);
  g_clear_pointer (&job, lamina_job_free);

  /* The same job's data changed: the id stays. */
  dialog = lamina_jobs_page_open_job_dialog (page, FALSE);
  g_assert_false (gtk_widget_get_sensitive (GTK_WIDGET (dialog->id_entry)));
  set_entry (dialog->ground_b_prime_entry, "6");
  assert_refused (lamina_job_dialog_save, dialog, "Characteristic dimension B′:");
  set_entry (dialog->ground_area_entry, "");
  set_entry (dialog->ground_perimeter_entry, "");
  set_entry (dialog->number_entry, "TO-2409");
  g_assert_true (lamina_job_dialog_save (dialog, &error));
  job = lamina_library_dup_job (library, "TO-2409", &error);
  g_assert_cmpfloat_with_epsilon (lamina_job_get_b_prime (job), 6.0, 1e-12);
  g_assert_cmpstr (job->number, ==, "TO-2409");
  g_clear_pointer (&job, lamina_job_free);

  /* An entry of the demo's terraced houses: area and location, then a
   * move to a new draft revision of EW-101 (its first layer 10 mm
   * thicker), recorded in the job's log. */
  {
    g_autoptr(LaminaConstruction) c = lamina_library_dup_construction (library, "demo-ew-101", 0, &error);

    ((LaminaLayer *) c->layers->pdata[0])->thickness += 10;
    g_assert_true (lamina_library_save_construction (library, c, c->revision, NULL, &error));
    g_assert_no_error (error);
    draft = c->revision;
  }
  g_assert_true (lamina_jobs_page_select (page, "demo-job-sloe-row"));
  job = lamina_library_dup_job (library, "demo-job-sloe-row", &error);
  n_log = job->log->len;
  g_clear_pointer (&job, lamina_job_free);
  entry_dialog = lamina_jobs_page_open_entry_dialog (page, 1);
  set_entry (entry_dialog->area_entry, "-4");
  assert_refused (lamina_job_entry_dialog_save, entry_dialog, "Area:");
  set_entry (entry_dialog->area_entry, "490,5");
  set_entry (entry_dialog->location_entry, "All elevations");
  draft_text = g_strdup_printf ("Revision %d ", draft);
  gtk_drop_down_set_selected (entry_dialog->revision_dropdown,
                              find_choice (entry_dialog->revision_dropdown, draft_text));
  g_assert_true (lamina_job_entry_dialog_save (entry_dialog, &error));
  g_assert_no_error (error);
  job = lamina_library_dup_job (library, "demo-job-sloe-row", &error);
  e = lamina_job_find_entry (job, 1);
  g_assert_cmpfloat (e->area, ==, 490.5);
  g_assert_cmpstr (e->location, ==, "All elevations");
  g_assert_cmpint (e->revision, ==, draft);
  g_assert_cmpuint (job->log->len, ==, n_log + 1);
  g_clear_pointer (&job, lamina_job_free);

  /* A hand-entered junction: Σ ψ·l grows by 0.05 × 30 = 1.5 W/K. */
  junction_dialog = lamina_jobs_page_open_junction_dialog (page, 0);
  set_entry (junction_dialog->name_entry, "Window head");
  set_entry (junction_dialog->psi_entry, "0.05 W/(m·K)");
  set_entry (junction_dialog->length_entry, "");
  assert_refused (lamina_job_junction_dialog_save, junction_dialog, "Length:");
  set_entry (junction_dialog->length_entry, "30");
  g_assert_true (lamina_job_junction_dialog_save (junction_dialog, &error));
  job = lamina_library_dup_job (library, "demo-job-sloe-row", &error);
  g_assert_cmpuint (job->junctions->len, ==, 3);
  g_assert_cmpfloat_with_epsilon (((LaminaJobJunction *) job->junctions->pdata[2])->psi
                                  * ((LaminaJobJunction *) job->junctions->pdata[2])->length, 1.5, 1e-12);

  demo_window_close (&d);
}

/* The demo's invented target table changed in the window: a stricter
 * external-wall maximum (0.15 W/(m²·K), below EW-201's 0.168) turns the
 * school's classroom wall to "not met" on the job; faults name the row
 * and the field; a new set is stored with its moisture criterion. */
static void
test_target_sets (void)
{
  g_autoptr(GError) error = NULL;
  const char *build = g_getenv ("LAMINA_BUILD_DIR");
  g_autofree char *png = g_build_filename (build ? build : ".", "tests", "app", "target-set-dialog.png", NULL);
  g_autoptr(LaminaTargetSet) set = NULL;
  DemoWindow d;
  LaminaLibrary *library;
  LaminaJobsPage *page;
  LaminaTargetSetDialog *dialog;
  LaminaTargetRow *row;
  guint added;

  demo_window_open (&d);
  library = d.library;
  page = d.page;
  g_assert_true (lamina_jobs_page_select (page, "demo-job-riverside"));
  dialog = lamina_jobs_page_open_target_sets (page);
  g_assert_cmpstr (gtk_editable_get_text (GTK_EDITABLE (dialog->id_entry)), ==, "demo-fallowmere-rules");
  g_assert_cmpuint (dialog->rows->len, ==, 6);
  row = dialog->rows->pdata[0];
  g_assert_cmpstr (gtk_editable_get_text (GTK_EDITABLE (row->use)), ==, "external-wall");
  g_assert_cmpstr (gtk_editable_get_text (GTK_EDITABLE (row->min_frsi)), ==, "0.75");
  g_assert_cmpint (gtk_drop_down_get_selected (row->moisture), ==, LAMINA_MOISTURE_NO_CONDENSATION);
  wait_for_draw (GTK_WIDGET (dialog));
  save_png (GTK_WIDGET (dialog), png);

  set_entry (((LaminaTargetRow *) dialog->rows->pdata[1])->min_frsi, "1.5");
  assert_refused (lamina_target_set_dialog_save, dialog, "Row 2 (roof), minimum fRsi:");
  set_entry (((LaminaTargetRow *) dialog->rows->pdata[1])->min_frsi, "");
  added = lamina_target_set_dialog_add_row (dialog);
  row = dialog->rows->pdata[added];
  set_entry (row->use, "external-wall");
  set_entry (row->max_u, "0.2");
  assert_refused (lamina_target_set_dialog_save, dialog, "Row 7 (external-wall), use:");
  set_entry (row->use, "ceiling-heated");
  set_entry (row->max_u, "low");
  assert_refused (lamina_target_set_dialog_save, dialog, "Row 7 (ceiling-heated), maximum U:");
  g_signal_emit_by_name (row->remove, "clicked");
  g_assert_true (row->removed);
  set_entry (((LaminaTargetRow *) dialog->rows->pdata[0])->max_u, "0.15");
  g_assert_true (lamina_target_set_dialog_save (dialog, &error));
  g_assert_no_error (error);
  set = lamina_library_dup_target_set (library, "demo-fallowmere-rules", &error);
  g_assert_cmpuint (set->targets->len, ==, 6);
  g_assert_cmpfloat (lamina_target_set_find (set, "external-wall")->max_u, ==, 0.15);
  g_assert_nonnull (strstr (lamina_jobs_page_get_summary (page), "3 of 5 entries meet their targets: 2 not met"));
  g_clear_pointer (&set, lamina_target_set_free);

  /* A new set. */
  lamina_target_set_dialog_show (dialog, NULL);
  g_assert_true (gtk_widget_get_sensitive (GTK_WIDGET (dialog->id_entry)));
  set_entry (dialog->id_entry, "office-set");
  assert_refused (lamina_target_set_dialog_save, dialog, "Name:");
  set_entry (dialog->name_entry, "Office table (invented)");
  row = dialog->rows->pdata[0];
  set_entry (row->use, "roof");
  set_entry (row->max_u, "0,2");
  gtk_drop_down_set_selected (row->element, LAMINA_ELEMENT_ROOF + 1);
  gtk_drop_down_set_selected (row->moisture, LAMINA_MOISTURE_NO_ACCUMULATION);
  g_assert_true (lamina_target_set_dialog_save (dialog, &error));
  g_assert_no_error (error);
  set = lamina_library_dup_target_set (library, "office-set", &error);
  g_assert_no_error (error);
  g_assert_cmpfloat (lamina_target_set_find (set, "roof")->max_u, ==, 0.2);
  g_assert_cmpint (lamina_target_set_find (set, "roof")->element, ==, LAMINA_ELEMENT_ROOF);
  g_assert_cmpint (lamina_target_set_find (set, "roof")->moisture, ==, LAMINA_MOISTURE_NO_ACCUMULATION);
  g_assert_true (isnan (lamina_target_set_find (set, "roof")->min_frsi));

  demo_window_close (&d);
}

/* "Delete Job…" asks first, naming the job and its entry count.  A job
 * submitted or built (its sheets may be out) is deleted only once its job
 * number is typed in full: a deliberate act for what cannot be undone
 * (common practice).  The library's constructions stay. */
static void
test_jobs_delete (void)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) jobs = NULL;
  g_autoptr(LaminaConstruction) kept = NULL;
  const char *build = g_getenv ("LAMINA_BUILD_DIR");
  g_autofree char *png = g_build_filename (build ? build : ".", "tests", "app", "job-delete-dialog.png", NULL);
  LaminaJobDeleteDialog *dialog;
  DemoWindow d;

  demo_window_open (&d);
  /* The demo's terraced houses: submitted, three entries. */
  g_assert_true (lamina_jobs_page_select (d.page, "demo-job-sloe-row"));
  dialog = lamina_jobs_page_open_delete_dialog (d.page);
  g_assert_nonnull (strstr (gtk_label_get_text (dialog->question_label), "TO-2401 “1 Sloe Row, six terraced houses”"));
  g_assert_nonnull (strstr (gtk_label_get_text (dialog->detail_label), "schedule of 3 entries"));
  g_assert_cmpstr (lamina_job_delete_dialog_get_key (dialog), ==, "TO-2401");
  g_assert_true (gtk_widget_get_visible (GTK_WIDGET (dialog->key_box)));
  g_assert_false (gtk_widget_get_sensitive (GTK_WIDGET (dialog->delete_button)));
  gtk_editable_set_text (GTK_EDITABLE (dialog->key_entry), "TO-2402");
  g_assert_false (gtk_widget_get_sensitive (GTK_WIDGET (dialog->delete_button)));
  wait_for_draw (GTK_WIDGET (dialog));
  save_png (GTK_WIDGET (dialog), png);
  g_test_message ("delete dialog rendered to %s", png);
  g_assert_false (lamina_job_delete_dialog_delete (dialog, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID);
  g_assert_true (g_str_has_prefix (error->message, "Job number: type “TO-2401”"));
  g_clear_error (&error);
  jobs = lamina_library_list_jobs (d.library, &error);
  g_assert_cmpuint (jobs->len, ==, 2);
  g_clear_pointer (&jobs, g_ptr_array_unref);
  gtk_editable_set_text (GTK_EDITABLE (dialog->key_entry), " TO-2401 ");
  g_assert_true (gtk_widget_get_sensitive (GTK_WIDGET (dialog->delete_button)));
  g_assert_true (lamina_job_delete_dialog_delete (dialog, &error));
  g_assert_no_error (error);
  jobs = lamina_library_list_jobs (d.library, &error);
  g_assert_cmpuint (jobs->len, ==, 1);
  g_clear_pointer (&jobs, g_ptr_array_unref);
  g_assert_null (lamina_jobs_page_get_job_id (d.page));

  /* The school: in design, five entries; asked, no number to type. */
  g_assert_true (lamina_jobs_page_select (d.page, "demo-job-riverside"));
  dialog = lamina_jobs_page_open_delete_dialog (d.page);
  g_assert_null (lamina_job_delete_dialog_get_key (dialog));
  g_assert_false (gtk_widget_get_visible (GTK_WIDGET (dialog->key_box)));
  g_assert_nonnull (strstr (gtk_label_get_text (dialog->detail_label), "schedule of 5 entries"));
  g_assert_true (gtk_widget_get_sensitive (GTK_WIDGET (dialog->delete_button)));
  g_assert_true (lamina_job_delete_dialog_delete (dialog, &error));
  jobs = lamina_library_list_jobs (d.library, &error);
  g_assert_cmpuint (jobs->len, ==, 0);
  kept = lamina_library_dup_construction (d.library, "demo-ew-203", 0, &error);
  g_assert_no_error (error);
  demo_window_close (&d);
}

/* The index of the result with office code @code. */
static guint
find_result (LaminaJobAddDialog *dialog,
             const char         *code)
{
  GPtrArray *results = lamina_job_add_dialog_get_results (dialog);

  for (guint i = 0; i < results->len; i++)
    if (g_strcmp0 (((LaminaSummary *) results->pdata[i])->code, code) == 0)
      return i;
  g_error ("%s is not among the results", code);
  return 0;
}

/* "Add from Library…" lists the chosen construction's revisions, the
 * latest approved selected (as `job add` pins by default); another one
 * can be pinned and is noted as not approved; a construction with no
 * approved revision offers its latest with that note.  EW-101 of the
 * demo: revision 3 approved, and here a draft 4 after it; EW-102: one
 * draft. */
static void
test_jobs_add_revision (void)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaJob) job = NULL;
  g_autoptr(LaminaJobReport) report = NULL;
  g_autoptr(LaminaConstruction) draft = NULL;
  const char *build = g_getenv ("LAMINA_BUILD_DIR");
  g_autofree char *png = g_build_filename (build ? build : ".", "tests", "app", "job-add-dialog.png", NULL);
  LaminaJobAddDialog *dialog;
  const LaminaJobLine *line;
  DemoWindow d;
  guint pick;

  demo_window_open (&d);
  draft = lamina_library_dup_construction (d.library, "demo-ew-101", 0, &error);
  ((LaminaLayer *) draft->layers->pdata[0])->thickness += 10;
  g_assert_true (lamina_library_save_construction (d.library, draft, 3, "A. Planner", &error));
  g_assert_no_error (error);
  g_assert_cmpint (draft->revision, ==, 4);
  g_assert_true (lamina_jobs_page_select (d.page, "demo-job-riverside"));
  dialog = lamina_jobs_page_open_add_dialog (d.page, "external-wall");
  g_assert_cmpint (lamina_job_add_dialog_get_revision (dialog), ==, 0);
  gtk_check_button_set_active (dialog->meets_check, FALSE);
  lamina_job_add_dialog_set_search (dialog, "EW-102");
  lamina_job_add_dialog_choose (dialog, find_result (dialog, "EW-102"));
  g_assert_cmpint (lamina_job_add_dialog_get_revision (dialog), ==, 1);
  g_assert_nonnull (strstr (gtk_label_get_text (dialog->revision_note), "Revision 1 is not approved"));

  lamina_job_add_dialog_set_search (dialog, "EW-101");
  pick = find_result (dialog, "EW-101");
  lamina_job_add_dialog_choose (dialog, pick);
  g_assert_cmpint (lamina_job_add_dialog_get_revision (dialog), ==, 3);
  g_assert_cmpuint (dialog->revisions->len, ==, 2);
  g_assert_cmpstr (gtk_label_get_text (dialog->revision_note), ==, "");
  g_assert_false (lamina_job_add_dialog_set_revision (dialog, 9));
  g_assert_true (lamina_job_add_dialog_set_revision (dialog, 4));
  g_assert_nonnull (strstr (gtk_label_get_text (dialog->revision_note), "Revision 4 is not approved"));
  wait_for_draw (GTK_WIDGET (dialog));
  save_png (GTK_WIDGET (dialog), png);
  g_test_message ("add dialog rendered to %s", png);
  g_assert_true (lamina_job_add_dialog_add (dialog, pick, 12, &error));
  g_assert_no_error (error);

  job = lamina_library_dup_job (d.library, "demo-job-riverside", &error);
  g_assert_cmpuint (job->entries->len, ==, 6);
  g_assert_cmpstr (((LaminaJobEntry *) job->entries->pdata[5])->construction, ==, "demo-ew-101");
  g_assert_cmpint (((LaminaJobEntry *) job->entries->pdata[5])->revision, ==, 4);
  report = lamina_library_check_job (d.library, "demo-job-riverside", &error);
  line = report->check->lines->pdata[5];
  g_assert_true (line->flags & LAMINA_ENTRY_NOT_APPROVED);
  demo_window_close (&d);
}

int
main (int   argc,
      char *argv[])
{
  gtk_test_init (&argc, &argv, NULL);
  g_test_add_func ("/app/jobs/page", test_jobs_page);
  g_test_add_func ("/app/jobs/edit", test_jobs_edit);
  g_test_add_func ("/app/jobs/target-sets", test_target_sets);
  g_test_add_func ("/app/jobs/add-revision", test_jobs_add_revision);
  g_test_add_func ("/app/jobs/delete", test_jobs_delete);
  return g_test_run ();
}
