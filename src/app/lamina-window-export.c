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
#include "lamina-window-private.h"
#include "sheet/lamina-sheet.h"

typedef void (*ChooserDone) (LaminaWindow *self, GFile *file);

static void
on_chooser_response_cb (GtkNativeDialog *dialog,
                        int              response,
                        LaminaWindow    *self)
{
  ChooserDone done = g_object_get_data (G_OBJECT (dialog), "lamina-done");

  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr(GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));

      done (self, file);
    }
  gtk_native_dialog_destroy (dialog);
  g_object_unref (dialog);
  g_object_unref (self);
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
  GtkFileChooserNative *chooser;
  g_autoptr(GtkFileFilter) filter = gtk_file_filter_new ();

  chooser = gtk_file_chooser_native_new (title, GTK_WINDOW (self),
                                         save ? GTK_FILE_CHOOSER_ACTION_SAVE : GTK_FILE_CHOOSER_ACTION_OPEN,
                                         save ? _("_Export") : _("_Import"), _("_Cancel"));
  gtk_file_filter_add_pattern (filter, pattern);
  gtk_file_filter_set_name (filter, pattern_name);
  gtk_file_chooser_add_filter (GTK_FILE_CHOOSER (chooser), filter);
  if (save && suggested != NULL)
    gtk_file_chooser_set_current_name (GTK_FILE_CHOOSER (chooser), suggested);
  gtk_native_dialog_set_modal (GTK_NATIVE_DIALOG (chooser), TRUE);
  g_object_set_data (G_OBJECT (chooser), "lamina-done", done);
  g_signal_connect (chooser, "response", G_CALLBACK (on_chooser_response_cb), g_object_ref (self));
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (chooser));
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

static void
on_progress_cb (gpointer user_data,
                guint    done,
                guint    total)
{
  GtkProgressBar *bar = user_data;

  if (bar == NULL || total == 0)
    return;
  gtk_progress_bar_set_fraction (bar, (double) done / total);
  /* The catalogue is written on the main thread (the library is used from
   * one thread at a time): let the progress and Cancel button breathe. */
  while (g_main_context_pending (NULL))
    g_main_context_iteration (NULL, FALSE);
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

static gboolean
write_catalogue (LaminaWindow    *self,
                 const char      *path,
                 GtkProgressBar  *bar,
                 GCancellable    *cancellable,
                 GError         **error)
{
  g_autofree char *practice = NULL;
  g_autoptr(GPtrArray) ids = NULL;
  LaminaSheetOptions options;
  CatalogueFetch fetch;

  if (self->document != NULL)
    lamina_document_commit (self->document, NULL);
  ids = dup_listed_ids (self, error);
  if (ids == NULL)
    return FALSE;
  init_options (self, &options, &practice);
  fetch = (CatalogueFetch) { self->library, ids, cancellable };
  return lamina_sheet_write_catalogue (path, TRUE, &options, ids->len,
                                       fetch_construction_cb, &fetch,
                                       on_progress_cb, bar, error);
}

gboolean
lamina_window_export_catalogue (LaminaWindow  *self,
                                const char    *path,
                                GError       **error)
{
  g_return_val_if_fail (LAMINA_IS_WINDOW (self), FALSE);
  return write_catalogue (self, path, NULL, NULL, error);
}

static void
on_cancel_clicked_cb (GCancellable *cancellable)
{
  g_cancellable_cancel (cancellable);
}

static void
catalogue_chosen (LaminaWindow *self,
                  GFile        *file)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(GCancellable) cancellable = g_cancellable_new ();
  g_autofree char *path = g_file_get_path (file);
  g_autofree char *message = NULL;
  GtkWidget *window = gtk_window_new ();
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 12);
  GtkWidget *bar = gtk_progress_bar_new ();
  GtkWidget *cancel = gtk_button_new_with_mnemonic (_("_Cancel"));

  gtk_window_set_title (GTK_WINDOW (window), _("Writing Catalogue"));
  gtk_window_set_transient_for (GTK_WINDOW (window), GTK_WINDOW (self));
  gtk_window_set_modal (GTK_WINDOW (window), TRUE);
  gtk_window_set_deletable (GTK_WINDOW (window), FALSE);
  gtk_widget_set_size_request (window, 360, -1);
  g_object_set (box, "margin-start", 18, "margin-end", 18, "margin-top", 18, "margin-bottom", 18, NULL);
  gtk_progress_bar_set_show_text (GTK_PROGRESS_BAR (bar), TRUE);
  gtk_widget_set_halign (cancel, GTK_ALIGN_END);
  gtk_box_append (GTK_BOX (box), bar);
  gtk_box_append (GTK_BOX (box), cancel);
  gtk_window_set_child (GTK_WINDOW (window), box);
  g_signal_connect_swapped (cancel, "clicked", G_CALLBACK (on_cancel_clicked_cb), cancellable);
  gtk_window_present (GTK_WINDOW (window));

  if (write_catalogue (self, path, GTK_PROGRESS_BAR (bar), cancellable, &error))
    message = g_strdup_printf (_("Catalogue written to %s"), path);
  else if (g_error_matches (error, G_IO_ERROR, G_IO_ERROR_CANCELLED))
    message = g_strdup (_("Catalogue cancelled; nothing was written"));
  else
    message = g_strdup (error->message);
  gtk_window_destroy (GTK_WINDOW (window));
  lamina_window_notify (self, message);
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

static void
show_import_report (LaminaWindow             *self,
                    const LaminaImportReport *report)
{
  GtkWidget *window = gtk_window_new ();
  GtkWidget *scroller = gtk_scrolled_window_new ();
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 6);
  g_autofree char *summary = lamina_import_report_dup_summary (report);
  GtkWidget *heading = gtk_label_new (summary);

  gtk_window_set_title (GTK_WINDOW (window), _("Import Report"));
  gtk_window_set_transient_for (GTK_WINDOW (window), GTK_WINDOW (self));
  gtk_window_set_default_size (GTK_WINDOW (window), 520, 420);
  g_object_set (box, "margin-start", 18, "margin-end", 18, "margin-top", 18, "margin-bottom", 18, NULL);
  gtk_label_set_wrap (GTK_LABEL (heading), TRUE);
  gtk_label_set_xalign (GTK_LABEL (heading), 0);
  gtk_widget_add_css_class (heading, "heading");
  gtk_box_append (GTK_BOX (box), heading);
  for (guint i = 0; i < report->items->len; i++)
    {
      const LaminaImportItem *item = g_ptr_array_index (report->items, i);
      GtkWidget *label = gtk_label_new (item->message ? item->message : item->name);

      gtk_label_set_wrap (GTK_LABEL (label), TRUE);
      gtk_label_set_xalign (GTK_LABEL (label), 0);
      if (item->action == LAMINA_IMPORT_CONFLICT)
        gtk_widget_add_css_class (label, "lamina-warning");
      gtk_box_append (GTK_BOX (box), label);
    }
  gtk_scrolled_window_set_child (GTK_SCROLLED_WINDOW (scroller), box);
  gtk_window_set_child (GTK_WINDOW (window), scroller);
  gtk_window_present (GTK_WINDOW (window));
}

static void
import_xml_chosen (LaminaWindow *self,
                   GFile        *file)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *path = g_file_get_path (file);
  g_autofree char *reviewer = g_settings_get_string (self->settings, "reviewer-name");
  g_autoptr(LaminaCatalogue) catalogue = lamina_catalogue_read_file (path, &error);
  g_autoptr(LaminaImportReport) report = NULL;

  if (catalogue != NULL)
    report = lamina_library_import (self->library, catalogue, LAMINA_IMPORT_DEFAULT,
                                    *reviewer ? reviewer : NULL, &error);
  if (report == NULL)
    {
      /* The message names the file and line; nothing was written. */
      lamina_window_notify (self, error->message);
      return;
    }
  lamina_window_refresh_list (self);
  show_import_report (self, report);
}

static void
import_xml_action (GtkWidget  *widget,
                   const char *name,
                   GVariant   *parameter)
{
  choose_file (LAMINA_WINDOW (widget), _("Import Catalogue XML"), FALSE, NULL,
               "*.xml", _("Catalogue XML"), import_xml_chosen);
}

/* Printing: the sheet PDF, drawn page by page through poppler, so that
 * paper and PDF come from one renderer. */

#ifdef HAVE_POPPLER
static void
on_draw_page_cb (GtkPrintOperation *operation,
                 GtkPrintContext   *context,
                 int                page_nr,
                 PopplerDocument   *document)
{
  PopplerPage *page = poppler_document_get_page (document, page_nr);
  cairo_t *cr = gtk_print_context_get_cairo_context (context);
  double width, height, scale;

  poppler_page_get_size (page, &width, &height);
  scale = MIN (gtk_print_context_get_width (context) / width,
               gtk_print_context_get_height (context) / height);
  cairo_scale (cr, scale, scale);
  poppler_page_render_for_printing (page, cr);
  g_object_unref (page);
}
#endif

static void
print_action (GtkWidget  *widget,
              const char *name,
              GVariant   *parameter)
{
  LaminaWindow *self = LAMINA_WINDOW (widget);
#ifdef HAVE_POPPLER
  g_autoptr(GError) error = NULL;
  g_autoptr(GtkPrintOperation) operation = NULL;
  g_autoptr(GObject) document = NULL; /* PopplerDocument: no autoptr in Debian 12's poppler */
  g_autofree char *dir = NULL;
  g_autofree char *path = NULL;
  g_autofree char *uri = NULL;

  if (self->document == NULL)
    return;
  dir = g_dir_make_tmp ("lamina-print-XXXXXX", &error);
  if (dir != NULL)
    {
      path = g_build_filename (dir, "sheet.pdf", NULL);
      if (lamina_window_export_sheet (self, path, &error))
        {
          uri = g_filename_to_uri (path, NULL, &error);
          document = uri ? G_OBJECT (poppler_document_new_from_file (uri, NULL, &error)) : NULL;
        }
    }
  if (document == NULL)
    {
      lamina_window_notify (self, error->message);
      return;
    }
  operation = gtk_print_operation_new ();
  gtk_print_operation_set_n_pages (operation, poppler_document_get_n_pages (POPPLER_DOCUMENT (document)));
  gtk_print_operation_set_job_name (operation, lamina_document_get_construction (self->document)->name);
  gtk_print_operation_set_embed_page_setup (operation, TRUE);
  g_signal_connect (operation, "draw-page", G_CALLBACK (on_draw_page_cb), document);
  if (gtk_print_operation_run (operation, GTK_PRINT_OPERATION_ACTION_PRINT_DIALOG,
                               GTK_WINDOW (self), &error) == GTK_PRINT_OPERATION_RESULT_ERROR)
    lamina_window_notify (self, error->message);
  g_unlink (path);
  g_rmdir (dir);
#else
  lamina_window_notify (self, _("Printing needs poppler-glib; export the sheet as PDF instead"));
#endif
}

void
lamina_window_install_export_actions (GtkWidgetClass *widget_class)
{
  gtk_widget_class_install_action (widget_class, "win.export-sheet", NULL, export_sheet_action);
  gtk_widget_class_install_action (widget_class, "win.export-catalogue", NULL, export_catalogue_action);
  gtk_widget_class_install_action (widget_class, "win.export-xml", NULL, export_xml_action);
  gtk_widget_class_install_action (widget_class, "win.import-xml", NULL, import_xml_action);
  gtk_widget_class_install_action (widget_class, "win.print", NULL, print_action);
}
