/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-layer-row.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-text.h"

struct _LaminaLayerRow
{
  GtkListBoxRow  parent_instance;

  /* template */
  GtkLabel      *number_label;
  GtkLabel      *name_label;
  GtkLabel      *detail_label;
  GtkSpinButton *thickness_spin;
  GtkLabel      *r_label;
  GtkLevelBar   *share_bar;

  guint          index;
  gboolean       updating;
};

G_DEFINE_FINAL_TYPE (LaminaLayerRow, lamina_layer_row, GTK_TYPE_LIST_BOX_ROW)

enum {
  THICKNESS_CHANGED,
  N_SIGNALS
};

static guint signals[N_SIGNALS];

static void
on_thickness_changed_cb (LaminaLayerRow *self)
{
  if (self->updating)
    return;
  g_signal_emit (self, signals[THICKNESS_CHANGED], 0, self->index,
                 gtk_spin_button_get_value (self->thickness_spin));
}

static void
lamina_layer_row_dispose (GObject *object)
{
  gtk_widget_dispose_template (GTK_WIDGET (object), LAMINA_TYPE_LAYER_ROW);
  G_OBJECT_CLASS (lamina_layer_row_parent_class)->dispose (object);
}

static void
lamina_layer_row_class_init (LaminaLayerRowClass *klass)
{
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  G_OBJECT_CLASS (klass)->dispose = lamina_layer_row_dispose;

  /* (layer index, thickness mm) */
  signals[THICKNESS_CHANGED] =
    g_signal_new ("thickness-changed", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST,
                  0, NULL, NULL, NULL, G_TYPE_NONE, 2, G_TYPE_UINT, G_TYPE_DOUBLE);

  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-layer-row.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaLayerRow, number_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaLayerRow, name_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaLayerRow, detail_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaLayerRow, thickness_spin);
  gtk_widget_class_bind_template_child (widget_class, LaminaLayerRow, r_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaLayerRow, share_bar);
}

static void
lamina_layer_row_init (LaminaLayerRow *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  g_signal_connect_object (self->thickness_spin, "value-changed",
                           G_CALLBACK (on_thickness_changed_cb), self, G_CONNECT_SWAPPED);
}

GtkWidget *
lamina_layer_row_new (void)
{
  return g_object_new (LAMINA_TYPE_LAYER_ROW, NULL);
}

/* A bridged layer is named by its parts: "Mineral wool + Softwood". */
static char *
dup_name (const LaminaLayer *layer)
{
  GString *text;

  if (layer->kind != LAMINA_LAYER_BRIDGED || layer->parts == NULL || layer->parts->len == 0)
    return g_strdup (lamina_layer_get_label (layer));
  text = g_string_new (NULL);
  for (guint i = 0; i < layer->parts->len; i++)
    {
      const LaminaPart *part = g_ptr_array_index (layer->parts, i);

      g_string_append_printf (text, "%s%s", i ? " + " : "",
                              part->material ? part->material->name : _("air"));
    }
  return g_string_free (text, FALSE);
}

static char *
dup_detail (const LaminaLayer *layer)
{
  switch (layer->kind)
    {
    case LAMINA_LAYER_MATERIAL:
      {
        g_autofree char *lambda = lamina_text_number (layer->material->conductivity, 3);

        return g_strdup_printf (_("λ %s W/(m·K)"), lambda);
      }
    case LAMINA_LAYER_RESISTANCE:
      {
        g_autofree char *r = lamina_text_number (layer->resistance, 2);

        return g_strdup_printf (_("Declared R %s m²·K/W"), r);
      }
    case LAMINA_LAYER_AIR:
      switch (layer->air)
        {
        case LAMINA_AIR_WELL_VENTILATED:
          return g_strdup (_("Well-ventilated air layer"));
        case LAMINA_AIR_SLIGHTLY_VENTILATED:
          return g_strdup (_("Slightly ventilated air layer"));
        case LAMINA_AIR_UNVENTILATED:
        default:
          return g_strdup (_("Unventilated air layer"));
        }
    case LAMINA_LAYER_BRIDGED:
    default:
      {
        GString *text = g_string_new (_("Bridged"));

        for (guint i = 0; layer->parts != NULL && i < layer->parts->len; i++)
          {
            g_autofree char *share = lamina_text_number (lamina_layer_get_part_fraction (layer, i) * 100, 1);

            g_string_append_printf (text, "%s %s %%", i ? " /" : "", share);
          }
        return g_string_free (text, FALSE);
      }
    }
}

void
lamina_layer_row_update (LaminaLayerRow          *self,
                         guint                    index,
                         const LaminaLayer       *layer,
                         const LaminaLayerResult *layer_result,
                         double                   r_total,
                         double                   snap_step)
{
  g_autofree char *number = g_strdup_printf ("%u", index + 1);
  g_autofree char *detail = dup_detail (layer);
  g_autofree char *name = dup_name (layer);
  g_autofree char *r = NULL;
  g_autofree char *r_text = NULL;
  g_autofree char *label = NULL;
  double share = 0;

  g_return_if_fail (LAMINA_IS_LAYER_ROW (self));

  self->index = index;
  self->updating = TRUE;
  gtk_label_set_text (self->number_label, number);
  gtk_label_set_text (self->name_label, name);
  gtk_widget_set_tooltip_text (GTK_WIDGET (self->name_label), name);
  gtk_label_set_text (self->detail_label, detail);
  gtk_adjustment_set_step_increment (gtk_spin_button_get_adjustment (self->thickness_spin),
                                     snap_step > 0 ? snap_step : 1.0);
  if (gtk_spin_button_get_value (self->thickness_spin) != layer->thickness)
    gtk_spin_button_set_value (self->thickness_spin, layer->thickness);
  self->updating = FALSE;

  if (layer_result != NULL && !isnan (layer_result->resistance))
    {
      r = lamina_text_number (layer_result->resistance, 3);
      r_text = g_strdup_printf ("R %s", r);
      if (r_total > 0)
        share = layer_result->disregarded ? 0 : layer_result->resistance / r_total;
    }
  gtk_label_set_text (self->r_label, r_text ? r_text : "R –");
  gtk_level_bar_set_value (self->share_bar, CLAMP (share, 0, 1));
  gtk_widget_set_tooltip_text (GTK_WIDGET (self->share_bar), NULL);
  {
    g_autofree char *pct = lamina_text_number (share * 100, 0);
    g_autofree char *tip = g_strdup_printf (_("%s %% of the total resistance"), pct);

    gtk_widget_set_tooltip_text (GTK_WIDGET (self->share_bar), tip);
  }

  label = g_strdup_printf (_("Layer %u, %s"), index + 1, name);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self), GTK_ACCESSIBLE_PROPERTY_LABEL, label, -1);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self->thickness_spin),
                                  GTK_ACCESSIBLE_PROPERTY_LABEL, _("Thickness in millimetres"), -1);
}

void
lamina_layer_row_set_writable (LaminaLayerRow *self,
                               gboolean        writable)
{
  g_return_if_fail (LAMINA_IS_LAYER_ROW (self));

  gtk_widget_set_sensitive (GTK_WIDGET (self->thickness_spin), writable);
}
