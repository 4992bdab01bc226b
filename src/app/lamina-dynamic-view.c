/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-dynamic-view.c: EN ISO 13786 figures for a 24 h period under the
 * EN ISO 6946 results.  The computation is lamina_dynamic_calculate; this
 * widget only lays the figures out. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-dynamic-view.h"

#include <glib/gi18n.h>

#include "lamina-dynamic.h"
#include "lamina-figure-grid.h"
#include "lamina-sheet-format.h"

typedef enum
{
  ROW_Y12,
  ROW_F,
  ROW_SHIFT,
  ROW_Y11,
  ROW_K1,
  ROW_K2,
  N_ROWS
} Row;

struct _LaminaDynamicView
{
  GtkWidget  parent_instance;

  /* template */
  GtkWidget *box;
  GtkGrid   *grid;
  GtkLabel  *values[N_ROWS];
  GtkLabel  *note;
};

G_DEFINE_FINAL_TYPE (LaminaDynamicView, lamina_dynamic_view, GTK_TYPE_WIDGET)

static void
add_row (LaminaDynamicView *self,
         Row                row,
         const char        *name,
         const char        *unit)
{
  self->values[row] = lamina_figure_grid_attach (self->grid, row, name, unit);
}

static void
lamina_dynamic_view_dispose (GObject *object)
{
  gtk_widget_dispose_template (GTK_WIDGET (object), LAMINA_TYPE_DYNAMIC_VIEW);
  G_OBJECT_CLASS (lamina_dynamic_view_parent_class)->dispose (object);
}

static void
lamina_dynamic_view_class_init (LaminaDynamicViewClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_dynamic_view_dispose;
  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (widget_class, "lamina-dynamic-view");
  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-dynamic-view.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaDynamicView, box);
  gtk_widget_class_bind_template_child (widget_class, LaminaDynamicView, grid);
  gtk_widget_class_bind_template_child (widget_class, LaminaDynamicView, note);
}

static void
lamina_dynamic_view_init (LaminaDynamicView *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  add_row (self, ROW_Y12, _("Periodic transmittance |Y12|"), "W/(m²·K)");
  add_row (self, ROW_F, _("Decrement factor f"), "");
  add_row (self, ROW_SHIFT, _("Time shift"), "h");
  add_row (self, ROW_Y11, _("Internal admittance |Y11|"), "W/(m²·K)");
  add_row (self, ROW_K1, _("Areal heat capacity κ1"), "kJ/(m²·K)");
  add_row (self, ROW_K2, _("Areal heat capacity κ2"), "kJ/(m²·K)");
}

static void
set_value (LaminaDynamicView *self,
           Row                row,
           double             value,
           int                decimals)
{
  char text[LAMINA_FORMAT_SIZE];

  gtk_label_set_text (self->values[row], lamina_format_fixed (text, value, decimals));
}

void
lamina_dynamic_view_update (LaminaDynamicView        *self,
                            const LaminaConstruction *construction,
                            const LaminaResult       *result)
{
  g_autoptr(GError) error = NULL;
  LaminaDynamic d;

  g_return_if_fail (LAMINA_IS_DYNAMIC_VIEW (self));

  if (construction == NULL || result == NULL
      || !lamina_dynamic_calculate (construction, result, LAMINA_DYNAMIC_PERIOD_HOURS, &d, &error))
    {
      for (guint i = 0; i < N_ROWS; i++)
        gtk_label_set_text (self->values[i], "–");
      gtk_widget_set_visible (GTK_WIDGET (self->grid), FALSE);
      gtk_label_set_text (self->note, error != NULL ? error->message : "");
      return;
    }
  gtk_widget_set_visible (GTK_WIDGET (self->grid), TRUE);
  set_value (self, ROW_Y12, d.periodic_transmittance, 3);
  set_value (self, ROW_F, d.decrement_factor, 2);
  set_value (self, ROW_SHIFT, d.time_shift, 1);
  set_value (self, ROW_Y11, d.admittance_inner, 2);
  set_value (self, ROW_K1, d.areal_heat_capacity_inner / 1000.0, 1);
  set_value (self, ROW_K2, d.areal_heat_capacity_outer / 1000.0, 1);
  gtk_label_set_text (self->note, d.bridged_equivalent
                      ? _("Bridged layers by their lower-limit equivalent: an approximation.")
                      : _("Time shift: how long after the outside peak the inside follows."));
}

const char *
lamina_dynamic_view_get_decrement_text (LaminaDynamicView *self)
{
  g_return_val_if_fail (LAMINA_IS_DYNAMIC_VIEW (self), NULL);
  return gtk_label_get_text (self->values[ROW_F]);
}
