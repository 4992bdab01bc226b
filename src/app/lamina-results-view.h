/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-results-view.h: the figures of a calculation (Rsi, Rse, R'T,
 * R''T, RT, U, ΔU, corrected U), the engine's warnings, the target U met
 * or not, the design conditions and the caution line. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-dynamic-view.h"

#include "lamina-calc.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_RESULTS_VIEW (lamina_results_view_get_type ())
G_DECLARE_FINAL_TYPE (LaminaResultsView, lamina_results_view, LAMINA, RESULTS_VIEW, GtkWidget)

/* @result NULL shows @error instead of figures. */
void        lamina_results_view_update   (LaminaResultsView        *self,
                                          const LaminaConstruction *construction,
                                          const LaminaResult       *result,
                                          const char               *error);
/* The text of the U figure shown (for tests and accessibility). */
const char *lamina_results_view_get_u_text (LaminaResultsView      *self);
/* The Rsi and Rse figures shown. */
const char *lamina_results_view_get_rsi_text (LaminaResultsView    *self);
const char *lamina_results_view_get_rse_text (LaminaResultsView    *self);

/* The EN ISO 13786 block under the figures. */
LaminaDynamicView *lamina_results_view_get_dynamic_view (LaminaResultsView *self);
/* The 2-D check block (LaminaFieldPanel), shown for constructions outside
 * EN ISO 6946. */
GtkWidget  *lamina_results_view_get_field_panel (LaminaResultsView *self);

G_END_DECLS
