/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The window's way out and in: sheet and catalogue PDFs, printing, and
 * the catalogue XML.  Files are chosen with GtkFileChooserNative (GTK 4.8
 * has no GtkFileDialog). */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include <glib/gi18n.h>
#include <glib/gstdio.h>

#ifdef HAVE_POPPLER
#include <poppler.h>
#endif

#include "exchange/lamina-catalogue.h"
#include "lamina-import-report-window.h"
#include "lamina-progress-window.h"
#include "lamina-window-private.h"
#include "sheet/lamina-section.h"
#include "sheet/lamina-sheet.h"

typedef void (*ChooserDone) (LaminaWindow *self, GFile *file);

/* What to do with the chosen file, for the response handler. */
typedef struct
{
  LaminaWindow *window;  /* owned */
  ChooserDone   done;
} Chooser;

static void
on_chooser_response_cb (GtkNativeDialog *dialog,
                        int              response,
                        Chooser         *chooser)
{
  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr(GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));

      /* Only the import dialog offers it ("true" when ticked). */
      chooser->window->import_keep_review =
        g_strcmp0 (gtk_file_chooser_get_choice (GTK_FILE_CHOOSER (dialog), "keep-review"), "true") == 0;

      chooser->done (chooser->window, file);
    }
  gtk_native_dialog_destroy (dialog);
  g_object_unref (dialog);
  g_object_unref (chooser->window);
  g_free (chooser);
}

/* @keep_review: offer the import's "keep the review state" choice. */
static void
choose_file_full (LaminaWindow *self,
                  const char   *title,
                  gboolean      save,
                  const char   *suggested,
                  const char   *pattern,
                  const char   *pattern_name,
                  gboolean      keep_review,
                  ChooserDone   done)
{
  GtkFileChooserNative *native;
  g_autoptr(GtkFileFilter) filter = gtk_file_filter_new ();
  Chooser *chooser = g_new0 (Chooser, 1);

  native = gtk_file_chooser_native_new (title, GTK_WINDOW (self),
                                        save ? GTK_FILE_CHOOSER_ACTION_SAVE : GTK_FILE_CHOOSER_ACTION_OPEN,
                                        save ? _("_Export") : _("_Import"), _("_Cancel"));
  gtk_file_filter_add_pattern (filter, pattern);
  gtk_file_filter_set_name (filter, pattern_name);
  gtk_file_chooser_add_filter (GTK_FILE_CHOOSER (native), filter);
  if (save && suggested != NULL)
    gtk_file_chooser_set_current_name (GTK_FILE_CHOOSER (native), suggested);
  gtk_native_dialog_set_modal (GTK_NATIVE_DIALOG (native), TRUE);
  chooser->window = g_object_ref (self);
  chooser->done = done;
  if (keep_review)
    {
      gtk_file_chooser_add_choice (GTK_FILE_CHOOSER (native), "keep-review",
                                   _("Keep the document’s checked and approved states (approved elsewhere)"),
                                   NULL, NULL);
      gtk_file_chooser_set_choice (GTK_FILE_CHOOSER (native), "keep-review", "false");
    }
  g_signal_connect (native, "response", G_CALLBACK (on_chooser_response_cb), chooser);
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (native));
}

static void
choose_file (LaminaWindow *self,
             const char   *title,
             gboolean      save,
             const char   *suggested,
             const char   *pattern,
             const char   *pattern_name,
             ChooserDone   done)
{
  choose_file_full (self, title, save, suggested, pattern, pattern_name, FALSE, done);
}

static void
init_options (LaminaWindow       *self,
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
lamina_window_export_sheet (LaminaWindow  *self,
                            const char    *path,
                            GError       **error)
{
  g_autofree char *practice = NULL;
  LaminaSheetOptions options;

  g_return_val_if_fail (LAMINA_IS_WINDOW (self), FALSE);
  g_return_val_if_fail (self->document != NULL, FALSE);

  lamina_document_commit (self->document, NULL);
  init_options (self, &options, &practice);
  return lamina_sheet_write_pdf (path, TRUE, &options,
                                 lamina_document_get_construction (self->document), error);
}

static char *
dup_suggested_name (LaminaWindow *self,
                    const char   *extension)
{
  const LaminaConstruction *c = lamina_document_get_construction (self->document);
  g_autofree char *base = g_strdup (c->code ? c->code : c->name);

  g_strdelimit (base, "/\\:*?\"<>| ", '-');
  return g_strconcat (base, extension, NULL);
}

static void
sheet_chosen (LaminaWindow *self,
              GFile        *file)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *path = g_file_get_path (file);
  g_autofree char *message = NULL;

  if (!lamina_window_export_sheet (self, path, &error))
    {
      lamina_window_notify (self, error->message);
      return;
    }
  message = g_strdup_printf (_("Sheet written to %s"), path);
  lamina_window_notify (self, message);
}

static void
export_sheet_action (GtkWidget  *widget,
                     const char *name,
                     GVariant   *parameter)
{
  LaminaWindow *self = LAMINA_WINDOW (widget);
  g_autofree char *suggested = NULL;

  if (self->document == NULL)
    return;
  suggested = dup_suggested_name (self, ".pdf");
  choose_file (self, _("Export Sheet"), TRUE, suggested, "*.pdf", _("PDF documents"), sheet_chosen);
}

/* The section drawing alone, for the office's drawings: SVG (vectors),
 * or PNG when the name typed ends in .png. */
gboolean
lamina_window_export_section (LaminaWindow  *self,
                              const char    *path,
                              GError       **error)
{
  const LaminaConstruction *c;
  g_autoptr(LaminaResult) result = NULL;
  g_autofree char *lower = NULL;

  g_return_val_if_fail (LAMINA_IS_WINDOW (self), FALSE);
  g_return_val_if_fail (self->document != NULL, FALSE);

  lamina_document_commit (self->document, NULL);
  c = lamina_document_get_construction (self->document);
  result = lamina_calculate (c, error);
  if (result == NULL)
    return FALSE;
  lower = g_ascii_strdown (path, -1);
  if (g_str_has_suffix (lower, ".png"))
    return lamina_section_write_png (c, result, 1600, 1000, path, TRUE, error);
  return lamina_section_write_svg (c, result, 1600, 1000, path, TRUE, error);
}

static void
section_chosen (LaminaWindow *self,
                GFile        *file)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *path = g_file_get_path (file);
  g_autofree char *message = NULL;

  if (!lamina_window_export_section (self, path, &error))
    {
      lamina_window_notify (self, error->message);
      return;
    }
  message = g_strdup_printf (_("Section drawing written to %s"), path);
  lamina_window_notify (self, message);
}

static void
export_section_action (GtkWidget  *widget,
                       const char *name,
                       GVariant   *parameter)
{
  LaminaWindow *self = LAMINA_WINDOW (widget);
  g_autofree char *suggested = NULL;

  if (self->document == NULL)
    return;
  suggested = dup_suggested_name (self, "-section.svg");
  choose_file (self, _("Export Section Drawing"), TRUE, suggested, "*.svg", _("SVG drawings"), section_chosen);
}

/* Catalogue: the constructions listed (search and filters applied). */

typedef struct
{
  LaminaLibrary *library;
  GPtrArray     *ids;
  GCancellable  *cancellable;
} CatalogueFetch;

static LaminaConstruction *
fetch_construction_cb (gpointer   user_data,
                       guint      index,
                       GError   **error)
{
  CatalogueFetch *fetch = user_data;

  if (g_cancellable_set_error_if_cancelled (fetch->cancellable, error))
    return NULL;
  return lamina_library_dup_construction (fetch->library, g_ptr_array_index (fetch->ids, index), 0, error);
}

static GPtrArray *
dup_listed_ids (LaminaWindow  *self,
                GError       **error)
{
  g_autoptr(GPtrArray) summaries = NULL;
  LaminaLibraryQuery query;
  GPtrArray *ids;

  lamina_construction_list_get_query (self->list, &query);
  summaries = lamina_library_search (self->library, &query, error);
  if (summaries == NULL)
    return NULL;
  ids = g_ptr_array_new_with_free_func (g_free);
  for (guint i = 0; i < summaries->len; i++)
    g_ptr_array_add (ids, g_strdup (((LaminaSummary *) summaries->pdata[i])->id));
  return ids;
}

gboolean
lamina_window_export_catalogue (LaminaWindow  *self,
                                const char    *path,
                                GError       **error)
{
  g_autofree char *practice = NULL;
  g_autoptr(GPtrArray) ids = NULL;
  LaminaSheetOptions options;
  CatalogueFetch fetch;

  g_return_val_if_fail (LAMINA_IS_WINDOW (self), FALSE);

  if (self->document != NULL)
    lamina_document_commit (self->document, NULL);
  ids = dup_listed_ids (self, error);
  if (ids == NULL)
    return FALSE;
  init_options (self, &options, &practice);
  fetch = (CatalogueFetch) { self->library, ids, NULL };
  return lamina_sheet_write_catalogue (path, TRUE, &options, ids->len,
                                       fetch_construction_cb, &fetch, NULL, NULL, error);
}

/* The same in a worker thread (GTask), for the window: the worker reads
 * the library through a connection of its own (a LaminaLibrary is used
 * from one thread at a time), reports progress through two atomic
 * counters that the main thread shows, and stops at the next construction
 * once cancelled. */
typedef struct
{
  char           *library_path;
  char           *path;
  char           *practice;
  GPtrArray      *ids;
  GtkProgressBar *bar;       /* main thread only; weak */
  guint           progress_timeout;
  int             done;      /* atomic */
  int             total;     /* atomic */
} CatalogueJob;

static void
catalogue_job_free (CatalogueJob *job)
{
  g_clear_handle_id (&job->progress_timeout, g_source_remove);
  g_clear_weak_pointer (&job->bar);
  g_free (job->library_path);
  g_free (job->path);
  g_free (job->practice);
  g_ptr_array_unref (job->ids);
  g_free (job);
}

static void
on_worker_progress_cb (gpointer user_data,
                       guint    done,
                       guint    total)
{
  CatalogueJob *job = user_data;

  g_atomic_int_set (&job->total, (int) total);
  g_atomic_int_set (&job->done, (int) done);
}

static gboolean
show_progress_cb (gpointer user_data)
{
  CatalogueJob *job = user_data;
  int total = g_atomic_int_get (&job->total);

  if (job->bar != NULL && total > 0)
    gtk_progress_bar_set_fraction (job->bar, (double) g_atomic_int_get (&job->done) / total);
  return G_SOURCE_CONTINUE;
}

static void
write_catalogue_thread (GTask        *task,
                        gpointer      source,
                        gpointer      task_data,
                        GCancellable *cancellable)
{
  CatalogueJob *job = task_data;
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GError) error = NULL;
  LaminaSheetOptions options;
  CatalogueFetch fetch;

  library = lamina_library_open (job->library_path, LAMINA_LIBRARY_OPEN_EXISTING, &error);
  if (library == NULL)
    {
      g_task_return_error (task, g_steal_pointer (&error));
      return;
    }
  lamina_sheet_options_init (&options);
  options.practice = job->practice;
  options.library = job->library_path;
  options.moisture_limit = lamina_library_get_moisture_limit (library);
  fetch = (CatalogueFetch) { library, job->ids, cancellable };
  if (lamina_sheet_write_catalogue (job->path, TRUE, &options, job->ids->len,
                                    fetch_construction_cb, &fetch,
                                    on_worker_progress_cb, job, &error))
    g_task_return_boolean (task, TRUE);
  else
    g_task_return_error (task, g_steal_pointer (&error));
}

void
lamina_window_export_catalogue_async (LaminaWindow        *self,
                                      const char          *path,
                                      GtkProgressBar      *bar,
                                      GCancellable        *cancellable,
                                      GAsyncReadyCallback  callback,
                                      gpointer             user_data)
{
  g_autoptr(GTask) task = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *practice = NULL;
  LaminaSheetOptions options;
  CatalogueJob *job;
  GPtrArray *ids;

  g_return_if_fail (LAMINA_IS_WINDOW (self));

  task = g_task_new (self, cancellable, callback, user_data);
  g_task_set_source_tag (task, lamina_window_export_catalogue_async);
  /* Save what is on screen first: the worker reads the file. */
  if (self->document != NULL)
    lamina_document_commit (self->document, NULL);
  ids = dup_listed_ids (self, &error);
  if (ids == NULL)
    {
      g_task_return_error (task, g_steal_pointer (&error));
      return;
    }
  init_options (self, &options, &practice);
  job = g_new0 (CatalogueJob, 1);
  job->library_path = g_strdup (lamina_library_get_path (self->library));
  job->path = g_strdup (path);
  job->practice = g_strdup (options.practice);
  job->ids = ids;
  g_set_weak_pointer (&job->bar, bar);
  if (bar != NULL)
    job->progress_timeout = g_timeout_add (100, show_progress_cb, job);
  g_task_set_task_data (task, job, (GDestroyNotify) catalogue_job_free);
  g_task_run_in_thread (task, write_catalogue_thread);
}

gboolean
lamina_window_export_catalogue_finish (LaminaWindow  *self,
                                       GAsyncResult  *result,
                                       GError       **error)
{
  CatalogueJob *job;

  g_return_val_if_fail (g_task_is_valid (result, self), FALSE);

  /* No more progress once done (the bar goes with its window). */
  job = g_task_get_task_data (G_TASK (result));
  if (job != NULL)
    {
      show_progress_cb (job);
      g_clear_handle_id (&job->progress_timeout, g_source_remove);
    }
  return g_task_propagate_boolean (G_TASK (result), error);
}

static void
catalogue_written_cb (GObject      *source,
                      GAsyncResult *result,
                      gpointer      user_data)
{
  LaminaWindow *self = LAMINA_WINDOW (source);
  g_autoptr(GtkWindow) progress = user_data;
  g_autoptr(GError) error = NULL;
  g_autofree char *message = NULL;
  CatalogueJob *job = g_task_get_task_data (G_TASK (result));

  if (lamina_window_export_catalogue_finish (self, result, &error))
    message = g_strdup_printf (_("Catalogue written to %s"), job->path);
  else if (g_error_matches (error, G_IO_ERROR, G_IO_ERROR_CANCELLED))
    message = g_strdup (_("Catalogue cancelled; nothing was written"));
  else
    message = g_strdup (error->message);
  gtk_window_destroy (progress);
  lamina_window_notify (self, message);
}

static void
catalogue_chosen (LaminaWindow *self,
                  GFile        *file)
{
  g_autoptr(GCancellable) cancellable = g_cancellable_new ();
  g_autofree char *path = g_file_get_path (file);
  LaminaProgressWindow *progress = lamina_progress_window_new (GTK_WINDOW (self), _("Writing Catalogue"),
                                                               cancellable);

  gtk_window_present (GTK_WINDOW (progress));
  lamina_window_export_catalogue_async (self, path, lamina_progress_window_get_bar (progress), cancellable,
                                        catalogue_written_cb, g_object_ref (progress));
}

static void
export_catalogue_action (GtkWidget  *widget,
                         const char *name,
                         GVariant   *parameter)
{
  choose_file (LAMINA_WINDOW (widget), _("Export Catalogue"), TRUE, _("catalogue.pdf"),
               "*.pdf", _("PDF documents"), catalogue_chosen);
}

/* XML */

static void
export_xml_chosen (LaminaWindow *self,
                   GFile        *file)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) ids = dup_listed_ids (self, &error);
  g_autoptr(LaminaCatalogue) catalogue = NULL;
  g_autofree char *path = g_file_get_path (file);
  g_autofree char *message = NULL;

  if (ids != NULL)
    {
      g_ptr_array_add (ids, NULL);
      catalogue = lamina_library_export (self->library, (const char * const *) ids->pdata, &error);
    }
  if (catalogue == NULL || !lamina_catalogue_write_file (catalogue, path, LAMINA_WRITE_DERIVED, &error))
    {
      lamina_window_notify (self, error->message);
      return;
    }
  message = g_strdup_printf (g_dngettext (NULL, "%u construction exported to %s",
                                          "%u constructions exported to %s", catalogue->constructions->len),
                             catalogue->constructions->len, path);
  lamina_window_notify (self, message);
}

static void
export_xml_action (GtkWidget  *widget,
                   const char *name,
                   GVariant   *parameter)
{
  choose_file (LAMINA_WINDOW (widget), _("Export Catalogue XML"), TRUE, _("library.xml"),
               "*.xml", _("Catalogue XML"), export_xml_chosen);
}

void
lamina_window_show_import_report (LaminaWindow             *self,
                                  const LaminaImportReport *report)
{
  gtk_window_present (GTK_WINDOW (lamina_import_report_window_new (GTK_WINDOW (self), report)));
}

static void
import_xml_chosen (LaminaWindow *self,
                   GFile        *file)
{
  g_autofree char *path = g_file_get_path (file);
  g_autofree char *reviewer = g_settings_get_string (self->settings, "reviewer-name");

  /* In a worker with progress and Cancel (lamina-window-import.c).
   * Another library's approvals arrive as drafts unless the user chose
   * to keep them (recorded as approved elsewhere). */
  lamina_window_import_file (self, path,
                             self->import_keep_review ? LAMINA_IMPORT_KEEP_REVIEW : LAMINA_IMPORT_DEFAULT,
                             reviewer);
}

static void
import_xml_action (GtkWidget  *widget,
                   const char *name,
                   GVariant   *parameter)
{
  choose_file_full (LAMINA_WINDOW (widget), _("Import Catalogue XML"), FALSE, NULL,
                    "*.xml", _("Catalogue XML"), TRUE, import_xml_chosen);
}

/* Printing: the sheet PDF, drawn page by page through poppler, so that
 * paper and PDF come from one renderer. */

double
lamina_window_print_scale (double paper_width,
                           double paper_height,
                           double sheet_width,
                           double sheet_height)
{
  /* Full size whenever the sheet fits the paper (half a millimetre of
   * slack for rounded paper sizes): a drawing stated at 1:5 must measure
   * 1:5 with a scale rule. */
  const double slack = 72.0 / 25.4 * 0.5;

  if (sheet_width <= paper_width + slack && sheet_height <= paper_height + slack)
    return 1.0;
  return MIN (paper_width / sheet_width, paper_height / sheet_height);
}

#ifdef HAVE_POPPLER
static void
on_draw_page_cb (GtkPrintOperation *operation,
                 GtkPrintContext   *context,
                 int                page_nr,
                 PopplerDocument   *document)
{
  PopplerPage *page = poppler_document_get_page (document, page_nr);
  cairo_t *cr = gtk_print_context_get_cairo_context (context);
  double width, height, paper_width, paper_height, scale;

  poppler_page_get_size (page, &width, &height);
  paper_width = gtk_print_context_get_width (context);
  paper_height = gtk_print_context_get_height (context);
  scale = lamina_window_print_scale (paper_width, paper_height, width, height);
  cairo_save (cr);
  cairo_translate (cr, (paper_width - width * scale) / 2, (paper_height - height * scale) / 2);
  cairo_scale (cr, scale, scale);
  poppler_page_render_for_printing (page, cr);
  cairo_restore (cr);
  if (scale < 1.0)
    {
      /* Reduced to fit a smaller paper: say so on the paper itself. */
      g_autofree char *note = g_strdup_printf (_("Printed at %.0f %% of full size: a drawing stated at 1:N "
                                                 "measures 1:(N × %.2f) on this paper."),
                                               scale * 100, 1.0 / scale);
      PangoLayout *layout = gtk_print_context_create_pango_layout (context);
      PangoFontDescription *font = pango_font_description_from_string ("DejaVu Sans Condensed Bold 7");

      pango_layout_set_font_description (layout, font);
      pango_layout_set_text (layout, note, -1);
      cairo_move_to (cr, 18, 6);
      cairo_set_source_rgb (cr, 0, 0, 0);
      pango_cairo_show_layout (cr, layout);
      pango_font_description_free (font);
      g_object_unref (layout);
    }
  g_object_unref (page);
}
#endif

/* Prints the open construction's sheet through the print dialog, or
 * straight to the PDF @export_path (tests, and what "Print to File"
 * gives). */
gboolean
lamina_window_print (LaminaWindow  *self,
                     const char    *export_path,
                     GError       **error)
{
#ifdef HAVE_POPPLER
  g_autoptr(GtkPrintOperation) operation = NULL;
  g_autoptr(GObject) document = NULL; /* PopplerDocument: no autoptr in Debian 12's poppler */
  g_autoptr(GtkPageSetup) setup = gtk_page_setup_new ();
  g_autoptr(GtkPaperSize) a4 = gtk_paper_size_new (GTK_PAPER_NAME_A4);
  g_autofree char *dir = NULL;
  g_autofree char *path = NULL;
  g_autofree char *uri = NULL;
  GtkPrintOperationResult result;

  g_return_val_if_fail (LAMINA_IS_WINDOW (self), FALSE);
  g_return_val_if_fail (self->document != NULL, FALSE);

  dir = g_dir_make_tmp ("lamina-print-XXXXXX", error);
  if (dir != NULL)
    {
      path = g_build_filename (dir, "sheet.pdf", NULL);
      if (lamina_window_export_sheet (self, path, error))
        {
          uri = g_filename_to_uri (path, NULL, error);
          document = uri ? G_OBJECT (poppler_document_new_from_file (uri, NULL, error)) : NULL;
        }
    }
  if (document == NULL)
    {
      if (path != NULL)
        g_unlink (path);
      if (dir != NULL)
        g_rmdir (dir);
      return FALSE;
    }
  operation = gtk_print_operation_new ();
  gtk_print_operation_set_n_pages (operation, poppler_document_get_n_pages (POPPLER_DOCUMENT (document)));
  gtk_print_operation_set_job_name (operation, lamina_document_get_construction (self->document)->name);
  gtk_print_operation_set_embed_page_setup (operation, TRUE);
  /* The sheet has its own margins: print on the whole paper, in points,
   * starting from the sheet's own paper size. */
  gtk_print_operation_set_use_full_page (operation, TRUE);
  gtk_print_operation_set_unit (operation, GTK_UNIT_POINTS);
  gtk_page_setup_set_paper_size_and_default_margins (setup, a4);
  gtk_print_operation_set_default_page_setup (operation, setup);
  g_signal_connect (operation, "draw-page", G_CALLBACK (on_draw_page_cb), document);
  if (export_path != NULL)
    gtk_print_operation_set_export_filename (operation, export_path);
  result = gtk_print_operation_run (operation,
                                    export_path ? GTK_PRINT_OPERATION_ACTION_EXPORT
                                                : GTK_PRINT_OPERATION_ACTION_PRINT_DIALOG,
                                    GTK_WINDOW (self), error);
  g_unlink (path);
  g_rmdir (dir);
  return result != GTK_PRINT_OPERATION_RESULT_ERROR;
#else
  g_set_error_literal (error, G_IO_ERROR, G_IO_ERROR_NOT_SUPPORTED,
                       _("Printing needs poppler-glib; export the sheet as PDF instead"));
  return FALSE;
#endif
}

static void
print_action (GtkWidget  *widget,
              const char *name,
              GVariant   *parameter)
{
  LaminaWindow *self = LAMINA_WINDOW (widget);
  g_autoptr(GError) error = NULL;

  if (self->document != NULL && !lamina_window_print (self, NULL, &error))
    lamina_window_notify (self, error->message);
}

void
lamina_window_install_export_actions (GtkWidgetClass *widget_class)
{
  gtk_widget_class_install_action (widget_class, "win.export-sheet", NULL, export_sheet_action);
  gtk_widget_class_install_action (widget_class, "win.export-section", NULL, export_section_action);
  gtk_widget_class_install_action (widget_class, "win.export-catalogue", NULL, export_catalogue_action);
  gtk_widget_class_install_action (widget_class, "win.export-xml", NULL, export_xml_action);
  gtk_widget_class_install_action (widget_class, "win.import-xml", NULL, import_xml_action);
  gtk_widget_class_install_action (widget_class, "win.print", NULL, print_action);
}
