/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-target-dialog.c: "Meet Target U".  The solve is
 * lamina_solve_thickness on the construction as edited; the chart is the
 * sheet code's lamina_solve_chart_draw; applying is one pure "set
 * thickness" edit on the document, so it is one step on the undo stack. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-target-dialog.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-design.h"
#include "lamina-editor-state.h"
#include "lamina-number.h"
#include "lamina-sheet-format.h"
#include "lamina-text.h"

struct _LaminaTargetDialog
{
  GtkWindow           parent_instance;

  /* owned */
  LaminaDocument     *document;
  LaminaConstruction *construction;
  guint               index;
  LaminaSolve         solve;
  gboolean            has_solve;

  /* template */
  GtkEntry           *target_entry;
  GtkLabel           *exact_label;
  GtkLabel           *build_label;
  GtkDrawingArea     *chart;
  GtkWidget          *apply_exact;
  GtkWidget          *apply_build;
};

G_DEFINE_FINAL_TYPE (LaminaTargetDialog, lamina_target_dialog, GTK_TYPE_WINDOW)

static void
draw_chart_cb (GtkDrawingArea *area,
               cairo_t        *cr,
               int             width,
               int             height,
               gpointer        user_data)
{
  LaminaTargetDialog *self = user_data;

  cairo_set_source_rgb (cr, 1, 1, 1);
  cairo_paint (cr);
  cairo_set_source_rgb (cr, 0, 0, 0);
  lamina_solve_chart_draw (cr, 0, 0, width, height, 11, self->construction,
                           self->has_solve ? &self->solve : NULL);
}

static void
show_solve (LaminaTargetDialog *self,
            const char         *error)
{
  char d[LAMINA_FORMAT_SIZE], u[LAMINA_U_TEXT_SIZE], uf[LAMINA_FORMAT_SIZE];
  g_autofree char *exact = NULL, *build = NULL, *button = NULL;

  gtk_widget_set_sensitive (self->apply_exact, self->has_solve);
  gtk_widget_set_sensitive (self->apply_build, self->has_solve);
  if (!self->has_solve)
    {
      gtk_label_set_text (self->exact_label, error ? error : "");
      gtk_label_set_text (self->build_label, "");
      gtk_button_set_label (GTK_BUTTON (self->apply_build), _("_Apply"));
      gtk_widget_queue_draw (GTK_WIDGET (self->chart));
      return;
    }
  exact = g_strdup_printf (_("Exact: %s mm, U = %s W/(m²·K)"), lamina_format_fixed (d, self->solve.thickness, 2),
                           lamina_format_fixed (uf, self->solve.u, 4));
  build = g_strdup_printf (self->solve.stock ? _("Build: %s mm (stock thickness), U = %s W/(m²·K) (%s)")
                                             : _("Build: %s mm (next 10 mm), U = %s W/(m²·K) (%s)"),
                           lamina_format_thickness (d, self->solve.thickness_snapped),
                           lamina_format_u (u, self->solve.u_snapped),
                           lamina_format_fixed (uf, self->solve.u_snapped, 4));
  button = g_strdup_printf (_("_Apply %s mm"), d);
  gtk_label_set_text (self->exact_label, exact);
  gtk_label_set_text (self->build_label, build);
  gtk_button_set_label (GTK_BUTTON (self->apply_build), button);
  gtk_widget_queue_draw (GTK_WIDGET (self->chart));
}

gboolean
lamina_target_dialog_set_target (LaminaTargetDialog *self,
                                 const char         *text)
{
  g_autoptr(GError) error = NULL;
  double target;

  g_return_val_if_fail (LAMINA_IS_TARGET_DIALOG (self), FALSE);

  if (g_strcmp0 (gtk_editable_get_text (GTK_EDITABLE (self->target_entry)), text) != 0)
    gtk_editable_set_text (GTK_EDITABLE (self->target_entry), text);
  self->has_solve = lamina_number_parse (LAMINA_FIELD_TARGET_U, text, &target, &error)
                    && lamina_solve_thickness (self->construction, self->index + 1, target, &self->solve, &error);
  gtk_widget_remove_css_class (GTK_WIDGET (self->target_entry), "error");
  if (!self->has_solve)
    gtk_widget_add_css_class (GTK_WIDGET (self->target_entry), "error");
  show_solve (self, error ? error->message : NULL);
  return self->has_solve;
}

static void
on_target_changed_cb (LaminaTargetDialog *self)
{
  lamina_target_dialog_set_target (self, gtk_editable_get_text (GTK_EDITABLE (self->target_entry)));
}

const LaminaSolve *
lamina_target_dialog_get_solve (LaminaTargetDialog *self)
{
  g_return_val_if_fail (LAMINA_IS_TARGET_DIALOG (self), NULL);
  return self->has_solve ? &self->solve : NULL;
}

void
lamina_target_dialog_apply (LaminaTargetDialog *self,
                            gboolean            snapped)
{
  g_return_if_fail (LAMINA_IS_TARGET_DIALOG (self));

  g_autoptr(GError) error = NULL;
  const LaminaConstruction *state;
  LaminaConstruction *next;

  if (!self->has_solve)
    return;
  state = lamina_document_get_construction (self->document);
  /* Exact to 0.01 mm (rounded up): what a site drawing can carry. */
  next = state == NULL || self->index >= state->layers->len ? NULL
         : lamina_edit_set_thickness (state, self->index,
                                      snapped ? self->solve.thickness_snapped
                                              : ceil (self->solve.thickness * 100) / 100,
                                      &error);
  if (next == NULL)
    {
      gtk_label_set_text (self->exact_label, error ? error->message : _("The construction has changed."));
      return;
    }
  lamina_document_apply (self->document, next, NULL, LAMINA_APPLY_DEFAULT);
  gtk_window_destroy (GTK_WINDOW (self));
}

static void
on_apply_exact_cb (LaminaTargetDialog *self)
{
  lamina_target_dialog_apply (self, FALSE);
}

static void
on_apply_build_cb (LaminaTargetDialog *self)
{
  lamina_target_dialog_apply (self, TRUE);
}

static void
lamina_target_dialog_dispose (GObject *object)
{
  LaminaTargetDialog *self = LAMINA_TARGET_DIALOG (object);

  g_clear_object (&self->document);
  g_clear_pointer (&self->construction, lamina_construction_free);
  G_OBJECT_CLASS (lamina_target_dialog_parent_class)->dispose (object);
}

static void
on_cancel_clicked_cb (LaminaTargetDialog *self)
{
  gtk_window_destroy (GTK_WINDOW (self));
}

static void
lamina_target_dialog_class_init (LaminaTargetDialogClass *klass)
{
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  G_OBJECT_CLASS (klass)->dispose = lamina_target_dialog_dispose;
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Escape, 0, "window.close", NULL);

  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-target-dialog.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaTargetDialog, target_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaTargetDialog, exact_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaTargetDialog, build_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaTargetDialog, chart);
  gtk_widget_class_bind_template_child (widget_class, LaminaTargetDialog, apply_exact);
  gtk_widget_class_bind_template_child (widget_class, LaminaTargetDialog, apply_build);
  gtk_widget_class_bind_template_callback (widget_class, on_target_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, on_cancel_clicked_cb);
  gtk_widget_class_bind_template_callback (widget_class, on_apply_exact_cb);
  gtk_widget_class_bind_template_callback (widget_class, on_apply_build_cb);
}

static void
lamina_target_dialog_init (LaminaTargetDialog *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  gtk_drawing_area_set_draw_func (self->chart, draw_chart_cb, self, NULL);
}

LaminaTargetDialog *
lamina_target_dialog_new (GtkWindow      *parent,
                          LaminaDocument *document,
                          guint           index)
{
  LaminaTargetDialog *self;
  const LaminaConstruction *c;
  g_autofree char *title = NULL, *target = NULL;

  g_return_val_if_fail (LAMINA_IS_DOCUMENT (document), NULL);
  c = lamina_document_get_construction (document);
  g_return_val_if_fail (c != NULL && index < c->layers->len, NULL);

  self = g_object_new (LAMINA_TYPE_TARGET_DIALOG, "transient-for", parent, NULL);
  self->document = g_object_ref (document);
  self->construction = lamina_construction_copy (c);
  self->index = index;
  title = g_strdup_printf (_("Meet Target U — Layer %u, %s"), index + 1,
                           lamina_layer_get_label (c->layers->pdata[index]));
  gtk_window_set_title (GTK_WINDOW (self), title);
  /* The construction's own target, else a common one to start from. */
  target = lamina_text_number (isnan (c->target_u) ? 0.15 : c->target_u, 2);
  lamina_target_dialog_set_target (self, target);
  return self;
}
