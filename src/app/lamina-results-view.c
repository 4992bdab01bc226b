/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-results-view.h"
#include "lamina-field-panel.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-dynamic-view.h"
#include "lamina-field.h"
#include "lamina-figure-grid.h"
#include "lamina-number.h"
#include "lamina-text.h"

typedef enum
{
  FIGURE_RSI,
  FIGURE_RSE,
  FIGURE_R_UPPER,
  FIGURE_R_LOWER,
  FIGURE_R_TOTAL,
  FIGURE_ERROR,
  FIGURE_U,
  FIGURE_DELTA_U,
  FIGURE_U_CORRECTED,
  N_FIGURES
} Figure;

struct _LaminaResultsView
{
  GtkWidget      parent_instance;

  /* template */
  GtkWidget     *scroller;
  GtkLabel      *u_label;
  GtkLabel      *target_label;
  GtkGrid       *figures;
  GtkBox        *warnings_box;
  LaminaDynamicView *dynamic_view;
  GtkSpinButton *inside_spin;
  GtkSpinButton *outside_spin;
  GtkEntry      *target_entry;

  /* owned */
  GtkLabel      *values[N_FIGURES];
  GtkWidget     *field_panel;    /* in the template's box, after the warnings */
  gboolean       updating;
};

G_DEFINE_FINAL_TYPE (LaminaResultsView, lamina_results_view, GTK_TYPE_WIDGET)

enum {
  CONDITIONS_CHANGED,
  N_SIGNALS
};

static guint signals[N_SIGNALS];

static void
add_figure (LaminaResultsView *self,
            Figure             figure,
            const char        *name,
            const char        *unit)
{
  self->values[figure] = lamina_figure_grid_attach (self->figures, figure, name, unit);
}

static void
set_figure (LaminaResultsView *self,
            Figure             figure,
            double             value,
            int                decimals)
{
  g_autofree char *text = lamina_text_number (value, decimals);

  gtk_label_set_text (self->values[figure], text);
}

static void
emit_conditions (LaminaResultsView *self)
{
  const char *text = gtk_editable_get_text (GTK_EDITABLE (self->target_entry));
  g_autoptr(GError) error = NULL;
  double target = NAN;

  if (self->updating)
    return;
  if (!lamina_text_is_blank (text) && !lamina_number_parse (LAMINA_FIELD_TARGET_U, text, &target, &error))
    {
      /* The message names the field and the allowed range. */
      gtk_widget_add_css_class (GTK_WIDGET (self->target_entry), "error");
      gtk_widget_set_tooltip_text (GTK_WIDGET (self->target_entry), error->message);
      return;
    }
  gtk_widget_remove_css_class (GTK_WIDGET (self->target_entry), "error");
  gtk_widget_set_tooltip_text (GTK_WIDGET (self->target_entry), NULL);
  g_signal_emit (self, signals[CONDITIONS_CHANGED], 0,
                 gtk_spin_button_get_value (self->inside_spin),
                 gtk_spin_button_get_value (self->outside_spin),
                 target);
}

static void
on_spin_value_changed_cb (LaminaResultsView *self)
{
  emit_conditions (self);
}

static void
on_target_activate_cb (LaminaResultsView *self)
{
  emit_conditions (self);
}

static gboolean
on_target_focus_out_cb (LaminaResultsView *self)
{
  emit_conditions (self);
  return FALSE;
}

static void
lamina_results_view_dispose (GObject *object)
{
  LaminaResultsView *self = LAMINA_RESULTS_VIEW (object);

  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_RESULTS_VIEW);

  G_OBJECT_CLASS (lamina_results_view_parent_class)->dispose (object);
}

static void
lamina_results_view_class_init (LaminaResultsViewClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_results_view_dispose;

  /* (inside °C, outside °C, target U or NAN) */
  signals[CONDITIONS_CHANGED] =
    g_signal_new ("conditions-changed", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST,
                  0, NULL, NULL, NULL, G_TYPE_NONE, 3,
                  G_TYPE_DOUBLE, G_TYPE_DOUBLE, G_TYPE_DOUBLE);

  g_type_ensure (LAMINA_TYPE_DYNAMIC_VIEW);
  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-results-view.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaResultsView, scroller);
  gtk_widget_class_bind_template_child (widget_class, LaminaResultsView, u_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaResultsView, target_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaResultsView, figures);
  gtk_widget_class_bind_template_child (widget_class, LaminaResultsView, warnings_box);
  gtk_widget_class_bind_template_child (widget_class, LaminaResultsView, dynamic_view);
  gtk_widget_class_bind_template_child (widget_class, LaminaResultsView, inside_spin);
  gtk_widget_class_bind_template_child (widget_class, LaminaResultsView, outside_spin);
  gtk_widget_class_bind_template_child (widget_class, LaminaResultsView, target_entry);
  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (widget_class, "lamina-results-view");
}

static void
lamina_results_view_init (LaminaResultsView *self)
{
  GtkEventController *focus;

  gtk_widget_init_template (GTK_WIDGET (self));
  self->field_panel = lamina_field_panel_new ();
  gtk_widget_insert_after (self->field_panel, gtk_widget_get_parent (GTK_WIDGET (self->warnings_box)),
                           GTK_WIDGET (self->warnings_box));

  add_figure (self, FIGURE_RSI, _("Inside surface Rsi"), "m²·K/W");
  add_figure (self, FIGURE_RSE, _("Outside surface Rse"), "m²·K/W");
  add_figure (self, FIGURE_R_UPPER, _("Upper limit R′T"), "m²·K/W");
  add_figure (self, FIGURE_R_LOWER, _("Lower limit R″T"), "m²·K/W");
  add_figure (self, FIGURE_R_TOTAL, _("Total resistance RT"), "m²·K/W");
  add_figure (self, FIGURE_ERROR, _("Relative error e"), "%");
  add_figure (self, FIGURE_U, _("U before corrections"), "W/(m²·K)");
  add_figure (self, FIGURE_DELTA_U, _("Corrections ΔU"), "W/(m²·K)");
  add_figure (self, FIGURE_U_CORRECTED, _("Corrected U"), "W/(m²·K)");

  g_signal_connect_object (self->inside_spin, "value-changed",
                           G_CALLBACK (on_spin_value_changed_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->outside_spin, "value-changed",
                           G_CALLBACK (on_spin_value_changed_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->target_entry, "activate",
                           G_CALLBACK (on_target_activate_cb), self, G_CONNECT_SWAPPED);
  focus = gtk_event_controller_focus_new ();
  g_signal_connect_object (focus, "leave", G_CALLBACK (on_target_focus_out_cb), self, G_CONNECT_SWAPPED);
  gtk_widget_add_controller (GTK_WIDGET (self->target_entry), focus);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self->inside_spin),
                                  GTK_ACCESSIBLE_PROPERTY_LABEL, _("Inside design temperature"), -1);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self->outside_spin),
                                  GTK_ACCESSIBLE_PROPERTY_LABEL, _("Outside design temperature"), -1);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self->target_entry),
                                  GTK_ACCESSIBLE_PROPERTY_LABEL, _("Target U value"), -1);
}

static void
clear_warnings (LaminaResultsView *self)
{
  GtkWidget *child;

  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->warnings_box))) != NULL)
    gtk_box_remove (self->warnings_box, child);
}

static void
add_warning (LaminaResultsView *self,
             const char        *text,
             const char        *css_class)
{
  GtkWidget *label = gtk_label_new (text);

  gtk_label_set_wrap (GTK_LABEL (label), TRUE);
  gtk_label_set_xalign (GTK_LABEL (label), 0);
  gtk_label_set_max_width_chars (GTK_LABEL (label), 40);
  gtk_widget_add_css_class (label, css_class);
  gtk_box_append (self->warnings_box, label);
}

static void
update_target (LaminaResultsView        *self,
               const LaminaConstruction *construction,
               const LaminaResult       *result)
{
  GtkWidget *label = GTK_WIDGET (self->target_label);
  g_autofree char *target = NULL;
  g_autofree char *text = NULL;

  gtk_widget_remove_css_class (label, "met");
  gtk_widget_remove_css_class (label, "not-met");
  if (result == NULL || !result->has_target)
    {
      gtk_label_set_text (self->target_label, _("No target U set"));
      return;
    }
  target = lamina_text_number (construction->target_u, 2);
  /* Outside the method's scope (metal bridging, limits far apart) a met
   * target is not ticked: the 2-D check has to confirm it. */
  if (result->target_met && lamina_field_is_advised (result))
    {
      text = g_strdup_printf (_("⚠ Meets the target U of %s by EN ISO 6946 only: confirm with the 2-D check"),
                              target);
      gtk_label_set_text (self->target_label, text);
      return;
    }
  if (result->target_met)
    text = g_strdup_printf (_("✓ Meets the target U of %s"), target);
  else
    text = g_strdup_printf (_("✗ Does not meet the target U of %s"), target);
  gtk_label_set_text (self->target_label, text);
  gtk_widget_add_css_class (label, result->target_met ? "met" : "not-met");
}

static void
update_conditions (LaminaResultsView        *self,
                   const LaminaConstruction *construction)
{
  g_autofree char *target = NULL;

  self->updating = TRUE;
  gtk_spin_button_set_value (self->inside_spin, construction->inside_temperature);
  gtk_spin_button_set_value (self->outside_spin, construction->outside_temperature);
  if (!gtk_widget_has_focus (GTK_WIDGET (self->target_entry)) &&
      !gtk_widget_is_focus (GTK_WIDGET (self->target_entry)))
    {
      target = isnan (construction->target_u) ? g_strdup ("")
                                              : lamina_text_number (construction->target_u, 2);
      gtk_editable_set_text (GTK_EDITABLE (self->target_entry), target);
    }
  self->updating = FALSE;
}

void
lamina_results_view_update (LaminaResultsView        *self,
                            const LaminaConstruction *construction,
                            const LaminaResult       *result,
                            const char               *error)
{
  char u[LAMINA_U_TEXT_SIZE];

  g_return_if_fail (LAMINA_IS_RESULTS_VIEW (self));

  clear_warnings (self);
  lamina_field_panel_set_construction (LAMINA_FIELD_PANEL (self->field_panel), construction, result);
  if (construction != NULL)
    update_conditions (self, construction);
  update_target (self, construction, result);
  lamina_dynamic_view_update (self->dynamic_view, construction, result);
  if (result == NULL)
    {
      for (guint i = 0; i < N_FIGURES; i++)
        gtk_label_set_text (self->values[i], "–");
      gtk_label_set_text (self->u_label, "–");
      if (error != NULL)
        add_warning (self, error, "lamina-error");
      return;
    }

  set_figure (self, FIGURE_RSI, result->rsi, 2);
  set_figure (self, FIGURE_RSE, result->rse, 2);
  set_figure (self, FIGURE_R_UPPER, result->r_upper, 3);
  set_figure (self, FIGURE_R_LOWER, result->r_lower, 3);
  set_figure (self, FIGURE_R_TOTAL, result->r_total, 3);
  set_figure (self, FIGURE_ERROR, result->relative_error * 100.0, 1);
  set_figure (self, FIGURE_U, result->u, 3);
  set_figure (self, FIGURE_DELTA_U, result->delta_u, 3);
  set_figure (self, FIGURE_U_CORRECTED, result->u_corrected, 3);
  gtk_label_set_text (self->u_label, lamina_format_u (u, result->u_corrected));

  for (guint i = 0; result->warnings != NULL && i < result->warnings->len; i++)
    {
      const LaminaWarning *warning = g_ptr_array_index (result->warnings, i);

      add_warning (self, warning->message,
                   warning->kind == LAMINA_WARNING_TARGET_NOT_MET ? "lamina-error" : "lamina-warning");
    }
}

const char *
lamina_results_view_get_u_text (LaminaResultsView *self)
{
  g_return_val_if_fail (LAMINA_IS_RESULTS_VIEW (self), NULL);
  return gtk_label_get_text (self->u_label);
}

const char *
lamina_results_view_get_rsi_text (LaminaResultsView *self)
{
  g_return_val_if_fail (LAMINA_IS_RESULTS_VIEW (self), NULL);
  return gtk_label_get_text (self->values[FIGURE_RSI]);
}

const char *
lamina_results_view_get_rse_text (LaminaResultsView *self)
{
  g_return_val_if_fail (LAMINA_IS_RESULTS_VIEW (self), NULL);
  return gtk_label_get_text (self->values[FIGURE_RSE]);
}

LaminaDynamicView *
lamina_results_view_get_dynamic_view (LaminaResultsView *self)
{
  g_return_val_if_fail (LAMINA_IS_RESULTS_VIEW (self), NULL);
  return self->dynamic_view;
}

GtkWidget *
lamina_results_view_get_field_panel (LaminaResultsView *self)
{
  g_return_val_if_fail (LAMINA_IS_RESULTS_VIEW (self), NULL);
  return self->field_panel;
}
