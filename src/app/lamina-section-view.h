/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-section-view.h: the construction's section on screen, drawn by
 * the sheet module's painter.  Click selects a layer; dragging a boundary
 * resizes the layer inside it, snapped to the snap step (Shift or Alt: a
 * tenth of it); the keyboard selects (arrows) and resizes (+/−, Alt for
 * the fine step) for users who do not use a pointer. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-calc.h"
#include "lamina-construction.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_SECTION_VIEW (lamina_section_view_get_type ())
G_DECLARE_FINAL_TYPE (LaminaSectionView, lamina_section_view, LAMINA, SECTION_VIEW, GtkWidget)

GtkWidget *lamina_section_view_new            (void);
/* Borrowed: the caller keeps both alive until the next call. */
void       lamina_section_view_set_construction (LaminaSectionView        *self,
                                                 const LaminaConstruction *construction,
                                                 const LaminaResult       *result);
int        lamina_section_view_get_selected   (LaminaSectionView        *self);
void       lamina_section_view_set_selected   (LaminaSectionView        *self,
                                               int                       layer);
void       lamina_section_view_set_snap_step  (LaminaSectionView        *self,
                                               double                    step);
gboolean   lamina_section_view_get_show_temperatures (LaminaSectionView *self);
void       lamina_section_view_set_show_temperatures (LaminaSectionView *self,
                                                      gboolean           show);
/* Zoom factor over "fit": 1.0 fits the drawing to the widget. */
double     lamina_section_view_get_zoom       (LaminaSectionView        *self);
void       lamina_section_view_set_zoom       (LaminaSectionView        *self,
                                               double                    zoom);

/* The drag, as the gesture drives it; public so that tests take the same
 * path.  @x/@y are widget coordinates.  begin returns FALSE when no
 * boundary is under the point.  update emits "resize" with live = TRUE,
 * end with live = FALSE. */
gboolean   lamina_section_view_drag_begin     (LaminaSectionView        *self,
                                               double                    x,
                                               double                    y);
void       lamina_section_view_drag_update    (LaminaSectionView        *self,
                                               double                    dx,
                                               double                    dy,
                                               gboolean                  fine);
void       lamina_section_view_drag_end       (LaminaSectionView        *self,
                                               double                    dx,
                                               double                    dy,
                                               gboolean                  fine);
/* The widget position of boundary @edge (0 … n) along the thickness axis,
 * and the point in the middle of it; FALSE before the first layout. */
gboolean   lamina_section_view_get_boundary_point (LaminaSectionView    *self,
                                                   guint                 edge,
                                                   double               *x,
                                                   double               *y);
/* Keyboard resizing: the selected layer grows by @steps snap steps. */
void       lamina_section_view_nudge          (LaminaSectionView        *self,
                                               int                       steps,
                                               gboolean                  fine);

/* "+" and "−" on the selected layer, from the section or the layer list:
 * one snap step whether or not the layout needs Shift for "+", a tenth of
 * it with Alt.  TRUE when the key was one of them. */
gboolean   lamina_section_view_resize_key     (LaminaSectionView        *self,
                                               guint                     keyval,
                                               GdkModifierType           state);

G_END_DECLS
