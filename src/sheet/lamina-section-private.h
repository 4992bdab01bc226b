/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-section-private.h: shared between the layout and the painter. */
#pragma once

#include "lamina-section.h"

G_BEGIN_DECLS

/* Margins around the body, in units of the text size. */
#define LAMINA_SECTION_SIDE_WIDTH   7.5 /* inside/outside labels beside a wall */
#define LAMINA_SECTION_SIDE_HEIGHT  3.6 /* … above and below a roof or floor */
#define LAMINA_SECTION_CHAIN_DEPTH  5.8 /* dimension chain above a wall */
#define LAMINA_SECTION_CHAIN_WIDTH  9.5 /* … beside a roof or floor */
#define LAMINA_SECTION_NUMBER_DEPTH 3.6 /* layer numbers */

/* In the local frame: t across the layers, s along the strip; "before"
 * is the side at smaller t or s. */
typedef struct
{
  double t_before, t_after;
  double s_before, s_after;
} LaminaSectionMargins;

void   lamina_section_get_margins       (LaminaSectionOrientation   orientation,
                                         const LaminaSectionStyle  *style,
                                         LaminaSectionMargins      *margins);
double lamina_section_layout_t_to_axis  (const LaminaSectionLayout *layout,
                                         double                     t);
double lamina_section_layout_s_extent   (const LaminaSectionLayout *layout);
/* A tapered layer (EN ISO 6946 Annex E) is laid out at its thick end, the
 * end drawn beside the dimension chain. */
double lamina_section_layer_drawn_thickness (const LaminaLayer  *layer);
void   lamina_section_layout_get_matrix (const LaminaSectionLayout *layout,
                                         cairo_matrix_t            *matrix);

G_END_DECLS

G_BEGIN_DECLS

/* Spreads labels along one axis: @want holds the wanted centres (in
 * ascending order), @size their extents; on return @pos holds centres at
 * least (size_i + size_j)/2 + @gap apart, as close to the wanted ones as
 * possible (clusters centre on their mean).  @scratch needs 3n doubles. */
void   lamina_section_spread            (const double *want,
                                         const double *size,
                                         guint         n,
                                         double        gap,
                                         double       *pos,
                                         double       *scratch);
/* The same, kept between @lo and @hi (the ends of the dimension chain,
 * whose extension lines a label must not cross) where they fit. */
void   lamina_section_spread_within     (const double *want,
                                         const double *size,
                                         guint         n,
                                         double        gap,
                                         double        lo,
                                         double        hi,
                                         double       *pos,
                                         double       *scratch);

/* The dimension chain's layer labels (pure): @extent[i] is label i's size
 * along the thickness axis; on return @want holds the layers' middles,
 * @pos the labels' centres, at least (extent_i + extent_j)/2 +
 * LAMINA_SECTION_LABEL_GAP units apart so that none overlaps another, kept
 * between the chain's ends where they fit, and @moved is non-zero for a
 * label drawn off its layer on a leader.  @scratch needs 3n doubles. */
#define LAMINA_SECTION_LABEL_GAP 0.25
void   lamina_section_layout_chain_labels (const LaminaSectionLayout *layout,
                                           const LaminaSectionStyle  *style,
                                           const double              *extent,
                                           double                    *want,
                                           double                    *pos,
                                           double                    *moved,
                                           double                    *scratch);
/* The labels' extents as the painter measures them (its fonts). */
void   lamina_section_measure_chain_labels (LaminaSection             *self,
                                            const LaminaSectionLayout *layout,
                                            const LaminaConstruction  *construction,
                                            const LaminaSectionStyle  *style,
                                            double                    *extent);

G_END_DECLS
