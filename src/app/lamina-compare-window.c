/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-compare-window.c: the comparison page on screen.  The page is
 * lamina_comparison_draw_page, scaled to the window, so what the window
 * shows is what the PDF prints. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-compare-window.h"

#include <glib/gi18n.h>
#include <stdlib.h>
#include <string.h>

#include "lamina-design.h"

struct _LaminaCompareWindow
{
  GtkWindow           parent_instance;

  /* owned */
  LaminaLibrary      *library;
  LaminaConstruction *a;
  LaminaConstruction *b;
  char               *label_a;
  char               *label_b;

  /* template */
  GtkEntry           *b_entry;
  GtkLabel           *message;
  GtkDrawingArea     *page;
  GtkWidget          *export_button;
};

G_DEFINE_FINAL_TYPE (LaminaCompareWindow, lamina_compare_window, GTK_TYPE_WINDOW)

static void
init_options (LaminaSheetOptions *options)
{
  lamina_sheet_options_init (options);
}

static void
draw_page_cb (GtkDrawingArea *area,
              cairo_t        *cr,
              int             width,
              int             height,
              gpointer        user_data)
{
  LaminaCompareWindow *self = user_data;
  LaminaSheetOptions options;
  double pw, ph, scale;

  cairo_set_source_rgb (cr, 0.85, 0.85, 0.85);
  cairo_paint (cr);
  if (self->b == NULL)
    return;
  init_options (&options);
  lamina_paper_get_size (options.paper, &pw, &ph);
  scale = MIN ((width - 16) / pw, (height - 16) / ph);
  cairo_translate (cr, (width - pw * scale) / 2, 8);
  cairo_scale (cr, scale, scale);
  cairo_rectangle (cr, 0, 0, pw, ph);
  cairo_clip (cr);
  lamina_comparison_draw_page (cr, &options, self->a, self->label_a, self->b, self->label_b, NULL);
}

static void
set_b (LaminaCompareWindow      *self,
       LaminaConstruction       *b,
       const char               *label)
{
  g_clear_pointer (&self->b, lamina_construction_free);
  g_clear_pointer (&self->label_b, g_free);
  self->b = b;
  self->label_b = g_strdup (label);
  gtk_widget_set_sensitive (self->export_button, b != NULL);
  gtk_label_set_text (self->message, b == NULL ? _("Type the code of B and press Enter (CODE@N for revision N).")
                                               : "");
  gtk_widget_queue_draw (GTK_WIDGET (self->page));
}

gboolean
lamina_compare_window_set_b (LaminaCompareWindow *self,
                             const char          *key)
{
  g_autofree char *id = g_strstrip (g_strdup (key));
  g_autoptr(GError) error = NULL;
  LaminaConstruction *b;
  char *at = strrchr (id, '@');
  int revision = 0;

  g_return_val_if_fail (LAMINA_IS_COMPARE_WINDOW (self), FALSE);

  if (at != NULL)
    {
      *at = '\0';
      revision = atoi (at + 1);
    }
  b = lamina_library_dup_construction (self->library, id, revision, &error);
  if (b == NULL)
    {
      /* An office code names one construction as well as its id. */
      g_autoptr(GPtrArray) rows = NULL;
      LaminaLibraryQuery q;

      lamina_library_query_init (&q);
      q.text = id;
      rows = lamina_library_search (self->library, &q, NULL);
      for (guint i = 0; rows != NULL && i < rows->len && b == NULL; i++)
        if (g_strcmp0 (((LaminaSummary *) rows->pdata[i])->code, id) == 0)
          b = lamina_library_dup_construction (self->library, ((LaminaSummary *) rows->pdata[i])->id, revision, NULL);
    }
  if (b == NULL)
    {
      gtk_label_set_text (self->message, error->message);
      gtk_widget_add_css_class (GTK_WIDGET (self->b_entry), "error");
      return FALSE;
    }
  gtk_widget_remove_css_class (GTK_WIDGET (self->b_entry), "error");
  set_b (self, b, NULL);
  return TRUE;
}

static void
on_b_activate_cb (LaminaCompareWindow *self)
{
  lamina_compare_window_set_b (self, gtk_editable_get_text (GTK_EDITABLE (self->b_entry)));
}

gboolean
lamina_compare_window_export (LaminaCompareWindow *self,
                              const char          *path,
                              GError             **error)
{
  LaminaSheetOptions options;

  g_return_val_if_fail (LAMINA_IS_COMPARE_WINDOW (self), FALSE);
  g_return_val_if_fail (self->b != NULL, FALSE);

  init_options (&options);
  return lamina_comparison_write_pdf (path, TRUE, &options, self->a, self->label_a, self->b, self->label_b, error);
}

static void
on_export_response_cb (GtkNativeDialog     *dialog,
                       int                  response,
                       LaminaCompareWindow *self)
{
  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr(GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));
      g_autofree char *path = file ? g_file_get_path (file) : NULL;
      g_autoptr(GError) error = NULL;

      if (path != NULL && !lamina_compare_window_export (self, path, &error))
        gtk_label_set_text (self->message, error->message);
      else if (path != NULL)
        {
          g_autofree char *done = g_strdup_printf (_("Comparison written to %s"), path);
          gtk_label_set_text (self->message, done);
        }
    }
  g_object_unref (dialog);
}

static void
on_export_clicked_cb (LaminaCompareWindow *self)
{
  GtkFileChooserNative *chooser = gtk_file_chooser_native_new (_("Export Comparison"), GTK_WINDOW (self),
                                                                GTK_FILE_CHOOSER_ACTION_SAVE, _("_Export"),
                                                                _("_Cancel"));
  g_autofree char *name = g_strdup_printf ("%s-%s.pdf", self->a->code ? self->a->code : self->a->id,
                                           self->b->code ? self->b->code : self->b->id);

  gtk_file_chooser_set_current_name (GTK_FILE_CHOOSER (chooser), name);
  g_signal_connect_object (chooser, "response", G_CALLBACK (on_export_response_cb), self, 0);
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (chooser));
}

static void
lamina_compare_window_dispose (GObject *object)
{
  LaminaCompareWindow *self = LAMINA_COMPARE_WINDOW (object);

  g_clear_object (&self->library);
  g_clear_pointer (&self->a, lamina_construction_free);
  g_clear_pointer (&self->b, lamina_construction_free);
  g_clear_pointer (&self->label_a, g_free);
  g_clear_pointer (&self->label_b, g_free);
  G_OBJECT_CLASS (lamina_compare_window_parent_class)->dispose (object);
}

static void
lamina_compare_window_class_init (LaminaCompareWindowClass *klass)
{
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  G_OBJECT_CLASS (klass)->dispose = lamina_compare_window_dispose;
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Escape, 0, "window.close", NULL);

  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-compare-window.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaCompareWindow, b_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaCompareWindow, message);
  gtk_widget_class_bind_template_child (widget_class, LaminaCompareWindow, page);
  gtk_widget_class_bind_template_child (widget_class, LaminaCompareWindow, export_button);
  gtk_widget_class_bind_template_callback (widget_class, on_b_activate_cb);
  gtk_widget_class_bind_template_callback (widget_class, on_export_clicked_cb);
}

static void
lamina_compare_window_init (LaminaCompareWindow *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  gtk_drawing_area_set_draw_func (self->page, draw_page_cb, self, NULL);
}

LaminaCompareWindow *
lamina_compare_window_new (GtkWindow                *parent,
                           LaminaLibrary            *library,
                           const LaminaConstruction *a,
                           const char               *label_a,
                           const LaminaConstruction *b,
                           const char               *label_b)
{
  LaminaCompareWindow *self;
  g_autofree char *title = NULL;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (library) && a != NULL, NULL);

  self = g_object_new (LAMINA_TYPE_COMPARE_WINDOW, "transient-for", parent, NULL);
  self->library = g_object_ref (library);
  self->a = lamina_construction_copy (a);
  self->label_a = g_strdup (label_a);
  title = g_strdup_printf (_("Compare %s"), a->code ? a->code : a->id);
  gtk_window_set_title (GTK_WINDOW (self), title);
  set_b (self, b ? lamina_construction_copy (b) : NULL, label_b);
  return self;
}
