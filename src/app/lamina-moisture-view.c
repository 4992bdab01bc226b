/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-moisture-view.c: the EN ISO 13788 check in the window.  The
 * computation is lamina_moisture_calculate_own and the pictures are the
 * sheet's (lamina-moisture-plot.h); this widget lays them out and lets the
 * user pick the month and the abscissa. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-moisture-view.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-moisture-plot.h"

struct _LaminaMoistureView
{
  GtkWidget  parent_instance;

  /* template */
  GtkWidget      *box;
  GtkLabel       *status;
  GtkLabel       *details;
  GtkDropDown    *month;
  GtkCheckButton *by_sd;
  GtkDrawingArea *plot;
  GtkDrawingArea *bars;
  GtkLabel       *warnings;

  /* owned */
  LaminaConstruction   *construction;
  LaminaMoistureResult *result;
  double                limit;   /* the office's, kg/m²; NAN: the default */
};

G_DEFINE_FINAL_TYPE (LaminaMoistureView, lamina_moisture_view, GTK_TYPE_WIDGET)

static void
draw_plot_cb (GtkDrawingArea *area,
              cairo_t        *cr,
              int             width,
              int             height,
              gpointer        user_data)
{
  LaminaMoistureView *self = user_data;

  if (self->result == NULL)
    return;
  cairo_set_source_rgb (cr, 1, 1, 1);
  cairo_paint (cr);
  lamina_moisture_plot_draw (cr, self->construction, self->result,
                             (int) gtk_drop_down_get_selected (self->month) + 1,
                             gtk_check_button_get_active (self->by_sd), 0, 0, width, height, 10.0);
}

static void
draw_bars_cb (GtkDrawingArea *area,
              cairo_t        *cr,
              int             width,
              int             height,
              gpointer        user_data)
{
  LaminaMoistureView *self = user_data;

  if (self->result == NULL)
    return;
  cairo_set_source_rgb (cr, 1, 1, 1);
  cairo_paint (cr);
  lamina_moisture_bars_draw (cr, self->result, 0, 0, width, height, 10.0);
}

static void
on_choice_changed_cb (LaminaMoistureView *self)
{
  gtk_widget_queue_draw (GTK_WIDGET (self->plot));
}

static void
lamina_moisture_view_dispose (GObject *object)
{
  LaminaMoistureView *self = LAMINA_MOISTURE_VIEW (object);

  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_MOISTURE_VIEW);
  g_clear_pointer (&self->construction, lamina_construction_free);
  g_clear_pointer (&self->result, lamina_moisture_result_free);
  G_OBJECT_CLASS (lamina_moisture_view_parent_class)->dispose (object);
}

static void
lamina_moisture_view_class_init (LaminaMoistureViewClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_moisture_view_dispose;
  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (widget_class, "moisture-view");
  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-moisture-view.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaMoistureView, box);
  gtk_widget_class_bind_template_child (widget_class, LaminaMoistureView, status);
  gtk_widget_class_bind_template_child (widget_class, LaminaMoistureView, details);
  gtk_widget_class_bind_template_child (widget_class, LaminaMoistureView, month);
  gtk_widget_class_bind_template_child (widget_class, LaminaMoistureView, by_sd);
  gtk_widget_class_bind_template_child (widget_class, LaminaMoistureView, plot);
  gtk_widget_class_bind_template_child (widget_class, LaminaMoistureView, bars);
  gtk_widget_class_bind_template_child (widget_class, LaminaMoistureView, warnings);
  gtk_widget_class_bind_template_callback (widget_class, on_choice_changed_cb);
}

static void
lamina_moisture_view_init (LaminaMoistureView *self)
{
  const char *months[LAMINA_MONTHS + 1];
  g_autoptr(GtkStringList) names = NULL;

  self->limit = NAN;
  gtk_widget_init_template (GTK_WIDGET (self));
  for (int m = 0; m < LAMINA_MONTHS; m++)
    months[m] = lamina_month_name (m + 1);
  months[LAMINA_MONTHS] = NULL;
  names = gtk_string_list_new (months);
  gtk_drop_down_set_model (self->month, G_LIST_MODEL (names));
  gtk_drawing_area_set_draw_func (self->plot, draw_plot_cb, self, NULL);
  gtk_drawing_area_set_draw_func (self->bars, draw_bars_cb, self, NULL);
}

static void
show_result (LaminaMoistureView *self)
{
  const LaminaMoistureResult *r = self->result;
  g_autofree char *status = NULL, *surface = NULL, *inter = NULL, *details = NULL;
  g_autoptr(GString) warnings = g_string_new (NULL);

  if (r->critical_month > 0)
    surface = g_strdup_printf (_("Surface (mould): fRsi %.3f, fRsi,min %.3f in %s — %s."), r->f_rsi,
                               r->f_rsi_min, lamina_month_name (r->critical_month),
                               r->surface_passes ? _("passes") : _("fails"));
  else
    surface = g_strdup_printf (_("Surface (mould): fRsi %.3f — passes."), r->f_rsi);
  if (r->condensation)
    inter = g_strdup_printf (_("Interstitial: up to %.3f kg/m² at the end of %s, %s."), r->max_accumulation,
                             lamina_month_name (r->max_month),
                             r->dries_out ? _("dries out") : _("does not dry out"));
  else
    inter = g_strdup (_("Interstitial: no condensation."));
  status = g_strdup_printf ("%s", lamina_moisture_result_fails (r) ? _("Moisture check fails")
                                                                  : _("Moisture check passes"));
  details = g_strdup_printf (_("Climate: %s.\n%s\n%s"), self->construction->moisture->climate_data->name
                             ? self->construction->moisture->climate_data->name
                             : self->construction->moisture->climate, surface, inter);
  for (guint i = 0; i < r->warnings->len; i++)
    g_string_append_printf (warnings, "%s%s", i ? "\n" : "",
                            ((LaminaMoistureWarning *) r->warnings->pdata[i])->message);
  gtk_label_set_text (self->status, status);
  gtk_label_set_text (self->details, details);
  gtk_label_set_text (self->warnings, warnings->str);
}

void
lamina_moisture_view_update (LaminaMoistureView       *self,
                             const LaminaConstruction *construction)
{
  g_autoptr(GError) error = NULL;
  gboolean had = self->result != NULL;

  g_return_if_fail (LAMINA_IS_MOISTURE_VIEW (self));

  g_clear_pointer (&self->construction, lamina_construction_free);
  g_clear_pointer (&self->result, lamina_moisture_result_free);
  if (construction != NULL && construction->moisture != NULL)
    {
      self->construction = lamina_construction_copy (construction);
      self->result = lamina_moisture_calculate_own (construction, self->limit, &error);
    }
  if (self->result != NULL)
    {
      /* A fresh construction opens on the month that matters. */
      if (!had)
        gtk_drop_down_set_selected (self->month, (guint) (MAX (self->result->condensation
                                                              ? self->result->max_month
                                                              : self->result->critical_month, 1) - 1));
      show_result (self);
    }
  else
    {
      gtk_label_set_text (self->status, construction != NULL && construction->moisture != NULL
                                        ? _("Moisture check not possible") : _("No moisture check"));
      gtk_label_set_text (self->details, error != NULL ? error->message
                          : _("Give the construction a climate and the inside conditions to check it for "
                              "surface and interstitial condensation (EN ISO 13788)."));
      gtk_label_set_text (self->warnings, "");
    }
  gtk_widget_set_visible (GTK_WIDGET (self->plot), self->result != NULL);
  gtk_widget_set_visible (GTK_WIDGET (self->bars), self->result != NULL);
  gtk_widget_queue_draw (GTK_WIDGET (self->plot));
  gtk_widget_queue_draw (GTK_WIDGET (self->bars));
}

void
lamina_moisture_view_set_limit (LaminaMoistureView *self,
                                double              limit)
{
  g_return_if_fail (LAMINA_IS_MOISTURE_VIEW (self));
  self->limit = LAMINA_MOISTURE_LIMIT_IS_VALID (limit) ? limit : NAN;
}

void
lamina_moisture_view_set_month (LaminaMoistureView *self,
                                int                 month)
{
  g_return_if_fail (LAMINA_IS_MOISTURE_VIEW (self));
  g_return_if_fail (month >= 1 && month <= LAMINA_MONTHS);
  gtk_drop_down_set_selected (self->month, (guint) month - 1);
}

void
lamina_moisture_view_set_by_sd (LaminaMoistureView *self,
                                gboolean            by_sd)
{
  g_return_if_fail (LAMINA_IS_MOISTURE_VIEW (self));
  gtk_check_button_set_active (self->by_sd, by_sd);
}

const char *
lamina_moisture_view_get_status (LaminaMoistureView *self)
{
  g_return_val_if_fail (LAMINA_IS_MOISTURE_VIEW (self), NULL);
  return gtk_label_get_text (self->status);
}

const LaminaMoistureResult *
lamina_moisture_view_get_result (LaminaMoistureView *self)
{
  g_return_val_if_fail (LAMINA_IS_MOISTURE_VIEW (self), NULL);
  return self->result;
}
