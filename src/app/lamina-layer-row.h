/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-layer-row.h: one layer in the editor's layer stack: number,
 * material and kind, thickness field, R and its share of RT. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-calc.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_LAYER_ROW (lamina_layer_row_get_type ())
G_DECLARE_FINAL_TYPE (LaminaLayerRow, lamina_layer_row, LAMINA, LAYER_ROW, GtkListBoxRow)

GtkWidget *lamina_layer_row_new    (void);
/* @layer_result and @r_total may be NULL / NAN when not calculated. */
void       lamina_layer_row_update (LaminaLayerRow          *self,
                                    guint                    index,
                                    const LaminaLayer       *layer,
                                    const LaminaLayerResult *layer_result,
                                    double                   r_total,
                                    double                   snap_step);

/* Off for a read-only library: the thickness shows but does not take input. */
void            lamina_layer_row_set_writable (LaminaLayerRow *self,
                                               gboolean        writable);

G_END_DECLS
