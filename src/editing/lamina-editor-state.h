/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-editor-state.h: the edits the window can make to a construction,
 * as pure functions.  Each takes the current state and returns a new one
 * (the caller owns it); the input is never changed.  They return NULL with
 * @error set (LAMINA_EDIT_ERROR, naming the layer or field) when the edit
 * makes no sense.  No GTK: the window, undo/redo and the tests share them. */
#pragma once

#include "lamina-construction.h"

G_BEGIN_DECLS

#define LAMINA_EDIT_ERROR (lamina_edit_error_quark ())
typedef enum
{
  LAMINA_EDIT_ERROR_NO_LAYER,  /* index out of range */
  LAMINA_EDIT_ERROR_INVALID,   /* value out of range */
} LaminaEditError;
GQuark lamina_edit_error_quark (void);

/* Thinnest layer the editor makes: 1 mm at the coarse step, the fine step
 * below that (EN ISO 6946 has no minimum; thin membranes are ~0.2 mm). */
#define LAMINA_EDIT_MIN_THICKNESS 0.1
#define LAMINA_EDIT_MAX_THICKNESS 5000.0

/* Rounds @thickness (mm) to the nearest multiple of @step (no rounding for
 * @step ≤ 0), then clamps to at least one step (or the minimum). */
double lamina_edit_snap (double thickness,
                         double step);

LaminaConstruction *lamina_edit_set_thickness  (const LaminaConstruction *state,
                                                guint                     index,
                                                double                    thickness,
                                                GError                  **error);
/* Inserts a copy of @layer before @index (index = n appends). */
LaminaConstruction *lamina_edit_insert_layer   (const LaminaConstruction *state,
                                                guint                     index,
                                                const LaminaLayer        *layer,
                                                GError                  **error);
LaminaConstruction *lamina_edit_remove_layer   (const LaminaConstruction *state,
                                                guint                     index,
                                                GError                  **error);
/* The copy goes right after the original (outwards). */
LaminaConstruction *lamina_edit_duplicate_layer (const LaminaConstruction *state,
                                                 guint                     index,
                                                 GError                  **error);
/* Moves layer @from so that it ends at position @to. */
LaminaConstruction *lamina_edit_move_layer     (const LaminaConstruction *state,
                                                guint                     from,
                                                guint                     to,
                                                GError                  **error);
/* A homogeneous layer of @material (copied); keeps the thickness. */
LaminaConstruction *lamina_edit_set_material   (const LaminaConstruction *state,
                                                guint                     index,
                                                const LaminaMaterial     *material,
                                                GError                  **error);
/* A bridged layer: the layer's material (or @infill when the layer has
 * none) fills between framing members of @framing, @width mm wide at
 * @spacing mm centres, named @member. */
LaminaConstruction *lamina_edit_make_bridged   (const LaminaConstruction *state,
                                                guint                     index,
                                                const LaminaMaterial     *infill,
                                                const LaminaMaterial     *framing,
                                                double                    width,
                                                double                    spacing,
                                                const char               *member,
                                                GError                  **error);
/* An air layer of class @air; Av in mm² per m (NAN = not given); face
 * emissivities default to 0.9 when NAN. */
LaminaConstruction *lamina_edit_make_air       (const LaminaConstruction *state,
                                                guint                     index,
                                                LaminaAirKind             air,
                                                double                    vent_area,
                                                double                    emissivity_inner,
                                                double                    emissivity_outer,
                                                GError                  **error);
/* A layer with a declared thermal resistance (m²·K/W). */
LaminaConstruction *lamina_edit_make_declared  (const LaminaConstruction *state,
                                                guint                     index,
                                                double                    resistance,
                                                GError                  **error);
LaminaConstruction *lamina_edit_set_corrections (const LaminaConstruction *state,
                                                 guint                     index,
                                                 const LaminaCorrections  *corrections,
                                                 GError                  **error);
/* Design conditions in °C and target U (NAN = none). */
LaminaConstruction *lamina_edit_set_conditions (const LaminaConstruction *state,
                                                double                    inside,
                                                double                    outside,
                                                double                    target_u,
                                                GError                  **error);
/* NULL leaves a field as it is. */
LaminaConstruction *lamina_edit_set_names      (const LaminaConstruction *state,
                                                const char               *code,
                                                const char               *name,
                                                const char               *description,
                                                GError                  **error);

/* The element.  A heat-flow direction (or outer side) that was the old
 * element's default follows to the new element's default; one the user
 * chose otherwise is kept (a roof pitched over 60° stays horizontal). */
LaminaConstruction *lamina_edit_set_element    (const LaminaConstruction *state,
                                                LaminaElement             element,
                                                GError                  **error);
/* The outer side an element takes when none is given: partitions indoor,
 * everything else outdoor. */
LaminaOuterSide     lamina_edit_default_outer_side (LaminaElement         element);
LaminaConstruction *lamina_edit_set_heat_flow  (const LaminaConstruction *state,
                                                LaminaHeatFlow            heat_flow,
                                                GError                  **error);
/* INDOOR: the outer surface faces another heated space, so Rsi applies on
 * both sides (EN ISO 6946:2017 6.8). */
LaminaConstruction *lamina_edit_set_outer_side (const LaminaConstruction *state,
                                                LaminaOuterSide           outer_side,
                                                GError                  **error);
/* Free text; empty or NULL clears. */
LaminaConstruction *lamina_edit_set_notes      (const LaminaConstruction *state,
                                                const char               *notes,
                                                GError                  **error);
/* Adds @tag (trimmed); refuses a blank tag or one already there (letter
 * case ignored). */
LaminaConstruction *lamina_edit_add_tag        (const LaminaConstruction *state,
                                                const char               *tag,
                                                GError                  **error);
LaminaConstruction *lamina_edit_remove_tag     (const LaminaConstruction *state,
                                                const char               *tag,
                                                GError                  **error);

/* Parts of bridged layer @index (lamina-editor-state-parts.c).  These
 * check the value they set; whether the parts add up is the core's
 * lamina_construction_validate, shown beside the parts as they are
 * edited.  @material NULL is an air part. */
LaminaConstruction *lamina_edit_add_part       (const LaminaConstruction *state,
                                                guint                     index,
                                                const LaminaMaterial     *material,
                                                double                    fraction,
                                                const char               *member,
                                                GError                  **error);
LaminaConstruction *lamina_edit_remove_part    (const LaminaConstruction *state,
                                                guint                     index,
                                                guint                     part,
                                                GError                  **error);
LaminaConstruction *lamina_edit_set_part_material (const LaminaConstruction *state,
                                                   guint                     index,
                                                   guint                     part,
                                                   const LaminaMaterial     *material,
                                                   GError                  **error);
/* An area fraction (0 < f ≤ 1); clears width and spacing. */
LaminaConstruction *lamina_edit_set_part_fraction (const LaminaConstruction *state,
                                                   guint                     index,
                                                   guint                     part,
                                                   double                    fraction,
                                                   GError                  **error);
/* Width at spacing (mm, 0 < width < spacing); clears the fraction. */
LaminaConstruction *lamina_edit_set_part_framing (const LaminaConstruction *state,
                                                  guint                     index,
                                                  guint                     part,
                                                  double                    width,
                                                  double                    spacing,
                                                  GError                  **error);
/* Makes @part the one that takes the remainder; the part that took it
 * before keeps the fraction it had, so the layer's make-up is unchanged. */
LaminaConstruction *lamina_edit_set_part_remainder (const LaminaConstruction *state,
                                                    guint                     index,
                                                    guint                     part,
                                                    GError                  **error);
/* The framing member's name (NULL or blank: none). */
LaminaConstruction *lamina_edit_set_part_member (const LaminaConstruction *state,
                                                 guint                     index,
                                                 guint                     part,
                                                 const char               *member,
                                                 GError                  **error);

/* The rest of the method (lamina-editor-state-method.c).  @ground NULL
 * takes the floor off the ground; @index −1 or LAMINA_TAPER_NONE leaves no
 * layer tapered (one layer at most is). */
LaminaConstruction *lamina_edit_set_ground   (const LaminaConstruction      *state,
                                              const LaminaGround            *ground,
                                              GError                       **error);
void                lamina_edit_default_ground (LaminaGround                *ground);
LaminaConstruction *lamina_edit_set_taper    (const LaminaConstruction      *state,
                                              int                            index,
                                              LaminaTaper                    taper,
                                              double                         thickness_max,
                                              GError                       **error);
LaminaConstruction *lamina_edit_set_unheated (const LaminaConstruction      *state,
                                              const LaminaUnheated          *unheated,
                                              GError                       **error);
LaminaConstruction *lamina_edit_set_surfaces (const LaminaConstruction      *state,
                                              const LaminaSurfaceConditions *surfaces,
                                              GError                       **error);

G_END_DECLS
