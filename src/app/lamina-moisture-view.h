/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-moisture-view.h: the Moisture page beside the results: the
 * EN ISO 13788 check of the construction being edited, recalculated with
 * every change (also while a layer is dragged). */
#pragma once

#include <gtk/gtk.h>

#include "lamina-moisture.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_MOISTURE_VIEW (lamina_moisture_view_get_type ())
G_DECLARE_FINAL_TYPE (LaminaMoistureView, lamina_moisture_view, LAMINA, MOISTURE_VIEW, GtkWidget)

/* Recalculates for @construction (NULL clears). */
/* The office's limit on the largest accumulation the check uses from the
 * next update (kg/m²; NAN: the default). */
void        lamina_moisture_view_set_limit   (LaminaMoistureView       *self,
                                              double                    limit);
void        lamina_moisture_view_update      (LaminaMoistureView       *self,
                                              const LaminaConstruction *construction);
/* The month plotted (1–12) and the abscissa (sd or thickness). */
void        lamina_moisture_view_set_month   (LaminaMoistureView       *self,
                                              int                       month);
void        lamina_moisture_view_set_by_sd   (LaminaMoistureView       *self,
                                              gboolean                  by_sd);
/* For tests: the verdict line, and the result shown (or NULL). */
const char *lamina_moisture_view_get_status  (LaminaMoistureView       *self);
const LaminaMoistureResult *lamina_moisture_view_get_result (LaminaMoistureView *self);

G_END_DECLS
