/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The window's edits as pure functions, undo/redo, the number notation
 * and the document's autosave, without a display. */
#include "config.h"

#include <locale.h>
#include <glib/gstdio.h>
#include <math.h>
#include <string.h>

#include "lamina-calc.h"
#include "lamina-document.h"
#include "lamina-editor-state.h"
#include "lamina-number.h"
#include "lamina-revision-diff.h"
#include "lamina-text.h"
#include "lamina-undo-stack.h"

/* Gypsum plasterboard 700 kg/m³, λ 0.21 W/(m·K): EN ISO 10456:2007
 * Table 3 (from memory).  Mineral wool λ 0.035: a typical declared value
 * (common practice). */
static LaminaConstruction *
new_wall (void)
{
  LaminaConstruction *c = lamina_construction_new ("w", "Test wall", LAMINA_ELEMENT_WALL);

  c->heat_flow = LAMINA_HEAT_FLOW_HORIZONTAL;
  lamina_construction_add_layer (c, lamina_layer_new_material (
    12.5, lamina_material_new ("gyp", "Plasterboard", LAMINA_CATEGORY_BOARD, 0.21)));
  lamina_construction_add_layer (c, lamina_layer_new_material (
    100, lamina_material_new ("mw", "Mineral wool", LAMINA_CATEGORY_INSULATION, 0.035)));
  return c;
}

static double
layer_thickness (const LaminaConstruction *c,
                 guint                     i)
{
  return ((LaminaLayer *) g_ptr_array_index (c->layers, i))->thickness;
}

static void
test_snap (void)
{
  /* Rounding to the nearest step (common practice for drawing tools). */
  const struct { double in, step, out; } cases[] = {
    { 123.0, 5.0, 125.0 },
    { 122.4, 5.0, 120.0 },
    { 122.5, 5.0, 125.0 },
    { 1.0, 5.0, 5.0 },      /* never thinner than one step */
    { -30.0, 5.0, 5.0 },
    { 12.34, 0.5, 12.5 },   /* the fine step (a tenth of 5 mm) */
    { 12.34, 0.0, 12.34 },  /* no snapping */
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    g_assert_cmpfloat_with_epsilon (lamina_edit_snap (cases[i].in, cases[i].step), cases[i].out, 1e-9);
}

static void
test_set_thickness_series (void)
{
  g_autoptr(LaminaConstruction) c = new_wall ();
  g_autoptr(LaminaConstruction) next = NULL;
  g_autoptr(LaminaResult) before = NULL;
  g_autoptr(LaminaResult) after = NULL;
  g_autoptr(GError) error = NULL;

  next = lamina_edit_set_thickness (c, 1, 150, &error);
  g_assert_no_error (error);
  /* The input is untouched: the editor keeps it for undo. */
  g_assert_cmpfloat (layer_thickness (c, 1), ==, 100);
  g_assert_cmpfloat (layer_thickness (next, 1), ==, 150);

  before = lamina_calculate (c, &error);
  g_assert_no_error (error);
  after = lamina_calculate (next, &error);
  g_assert_no_error (error);
  /* EN ISO 6946:2017 6.7.1: R = d/λ, and resistances in series add, so
   * 50 mm more at λ 0.035 adds 0.05/0.035 m²·K/W to RT. */
  g_assert_cmpfloat_with_epsilon (1 / after->u - 1 / before->u, 0.050 / 0.035, 1e-9);
  /* Rsi 0.13 + Rse 0.04 (Table 7, horizontal) + 0.0125/0.21 + 0.15/0.035. */
  g_assert_cmpfloat_with_epsilon (after->r_total, 0.13 + 0.04 + 0.0125 / 0.21 + 0.15 / 0.035, 1e-9);

  g_assert_null (lamina_edit_set_thickness (c, 5, 10, &error));
  g_assert_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_NO_LAYER);
  g_clear_error (&error);
  g_assert_null (lamina_edit_set_thickness (c, 0, 0, &error));
  g_assert_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID);
  g_assert_nonnull (strstr (error->message, "Layer 1"));
}

static void
test_layer_stack (void)
{
  g_autoptr(LaminaConstruction) c = new_wall ();
  g_autoptr(LaminaConstruction) dup = NULL;
  g_autoptr(LaminaConstruction) moved = NULL;
  g_autoptr(LaminaConstruction) removed = NULL;
  g_autoptr(GError) error = NULL;

  dup = lamina_edit_duplicate_layer (c, 0, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (dup->layers->len, ==, 3);
  g_assert_true (lamina_layer_equal (dup->layers->pdata[0], dup->layers->pdata[1]));

  moved = lamina_edit_move_layer (c, 0, 1, &error);
  g_assert_no_error (error);
  g_assert_cmpstr (lamina_layer_get_label (moved->layers->pdata[1]), ==, "Plasterboard");
  g_assert_cmpstr (lamina_layer_get_label (moved->layers->pdata[0]), ==, "Mineral wool");

  removed = lamina_edit_remove_layer (c, 0, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (removed->layers->len, ==, 1);
  g_assert_cmpuint (c->layers->len, ==, 2);
}

static void
test_layer_kinds (void)
{
  g_autoptr(LaminaConstruction) c = new_wall ();
  g_autoptr(LaminaMaterial) timber = lamina_material_new ("sw", "Softwood", LAMINA_CATEGORY_TIMBER, 0.13);
  g_autoptr(LaminaConstruction) bridged = NULL;
  g_autoptr(LaminaConstruction) declared = NULL;
  g_autoptr(LaminaConstruction) air = NULL;
  g_autoptr(LaminaResult) r = NULL;
  g_autoptr(GError) error = NULL;
  LaminaLayer *layer;

  /* 45 mm studs at 600 mm centres: framing fraction 45/600 = 0.075. */
  bridged = lamina_edit_make_bridged (c, 1, NULL, timber, 45, 600, "stud", &error);
  g_assert_no_error (error);
  layer = bridged->layers->pdata[1];
  g_assert_cmpint (layer->kind, ==, LAMINA_LAYER_BRIDGED);
  g_assert_cmpfloat_with_epsilon (lamina_layer_get_part_fraction (layer, 1), 0.075, 1e-12);
  g_assert_cmpfloat_with_epsilon (lamina_layer_get_part_fraction (layer, 0), 0.925, 1e-12);
  r = lamina_calculate (bridged, &error);
  g_assert_no_error (error);
  /* EN ISO 6946:2017 6.7.2: the upper limit is never below the lower. */
  g_assert_cmpfloat (r->r_upper, >=, r->r_lower);
  g_clear_pointer (&r, lamina_result_free);

  g_assert_null (lamina_edit_make_bridged (c, 1, NULL, timber, 600, 45, "stud", &error));
  g_assert_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID);
  g_clear_error (&error);

  declared = lamina_edit_make_declared (c, 1, 2.5, &error);
  g_assert_no_error (error);
  r = lamina_calculate (declared, &error);
  g_assert_no_error (error);
  /* A declared R adds as given (6.7.1). */
  g_assert_cmpfloat_with_epsilon (r->r_total, 0.13 + 0.04 + 0.0125 / 0.21 + 2.5, 1e-9);
  g_clear_pointer (&r, lamina_result_free);

  /* 25 mm unventilated air layer, horizontal flow: 0.18 m²·K/W,
   * EN ISO 6946:2017 Table 8 (from memory). */
  air = lamina_edit_set_thickness (c, 1, 25, &error);
  g_assert_no_error (error);
  g_clear_pointer (&c, lamina_construction_free);
  c = lamina_edit_make_air (air, 1, LAMINA_AIR_UNVENTILATED, NAN, NAN, NAN, &error);
  g_assert_no_error (error);
  r = lamina_calculate (c, &error);
  g_assert_no_error (error);
  g_assert_cmpfloat_with_epsilon (r->layers[1].resistance, 0.18, 0.005);
}

static void
test_undo_stack (void)
{
  g_autoptr(LaminaUndoStack) stack = lamina_undo_stack_new (10);
  g_autoptr(LaminaConstruction) a = new_wall ();
  g_autoptr(LaminaConstruction) b = lamina_edit_set_thickness (a, 1, 120, NULL);
  g_autoptr(LaminaConstruction) c = lamina_edit_set_thickness (b, 1, 140, NULL);
  g_autoptr(LaminaConstruction) undone = NULL;
  g_autoptr(LaminaConstruction) redone = NULL;

  /* Two steps of one drag merge into one undo step. */
  lamina_undo_stack_push (stack, a, "drag-1");
  lamina_undo_stack_push (stack, b, "drag-1");
  undone = lamina_undo_stack_undo (stack, c);
  g_assert_cmpfloat (layer_thickness (undone, 1), ==, 100);
  g_assert_false (lamina_undo_stack_can_undo (stack));
  redone = lamina_undo_stack_redo (stack, undone);
  g_assert_cmpfloat (layer_thickness (redone, 1), ==, 140);
  g_assert_false (lamina_undo_stack_can_redo (stack));
}

static void
test_text (void)
{
  double v = 0;

  g_autoptr(GError) error = NULL;

  /* The dialogs' numbers go through the core's field parser: a decimal
   * comma, a unit, a Unicode minus; refused out of range, naming the
   * field. */
  g_assert_true (lamina_number_parse (LAMINA_FIELD_CONDUCTIVITY, "0,035", &v, NULL));
  g_assert_cmpfloat (v, ==, 0.035);
  g_assert_true (lamina_number_parse (LAMINA_FIELD_THICKNESS, " 12.5 mm", &v, NULL));
  g_assert_cmpfloat (v, ==, 12.5);
  g_assert_true (lamina_number_parse (LAMINA_FIELD_OUTSIDE_TEMPERATURE, "−10", &v, NULL));
  g_assert_cmpfloat (v, ==, -10);
  g_assert_true (lamina_number_parse (LAMINA_FIELD_VENT_AREA, "1500 mm2", &v, NULL));
  g_assert_cmpfloat (v, ==, 1500);
  g_assert_true (lamina_number_parse (LAMINA_FIELD_FASTENER_COUNT, "4 1/m²", &v, NULL));
  g_assert_cmpfloat (v, ==, 4);
  g_assert_false (lamina_number_parse (LAMINA_FIELD_THICKNESS, "", &v, NULL));
  g_assert_false (lamina_number_parse (LAMINA_FIELD_THICKNESS, "abc", &v, NULL));
  g_assert_false (lamina_number_parse (LAMINA_FIELD_THICKNESS, "1.2.3", &v, NULL));
  /* EN ISO 6946:2017 Annex F.2: air gap correction levels 0, 1 and 2. */
  g_assert_false (lamina_number_parse (LAMINA_FIELD_AIR_GAP_LEVEL, "3", &v, &error));
  g_assert_nonnull (strstr (error->message, "air gap level"));
  g_clear_error (&error);
  g_assert_false (lamina_number_parse (LAMINA_FIELD_DRAINAGE_FACTOR, "1.5", &v, &error));
  g_assert_nonnull (strstr (error->message, "drainage factor"));
}

static void
test_revision_diff (void)
{
  g_autoptr(LaminaConstruction) a = new_wall ();
  g_autoptr(LaminaConstruction) b = lamina_edit_set_thickness (a, 1, 150, NULL);
  g_autoptr(GPtrArray) same = lamina_revision_diff (a, a);
  g_autoptr(GPtrArray) changed = lamina_revision_diff (a, b);

  g_assert_cmpuint (same->len, ==, 0);
  g_assert_cmpuint (changed->len, ==, 1);
  g_assert_nonnull (strstr (changed->pdata[0], "Mineral wool"));
  g_assert_nonnull (strstr (changed->pdata[0], "150 mm"));
}

static void
test_document_conflict (void)
{
  g_autofree char *dir = g_dir_make_tmp ("lamina-doc-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "library.sqlite", NULL);
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaLibrary) library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_NO_SEED, &error);
  g_autoptr(LaminaLibrary) other = NULL;
  g_autoptr(LaminaConstruction) wall = new_wall ();
  g_autoptr(LaminaConstruction) theirs = NULL;
  g_autoptr(LaminaConstruction) stored = NULL;
  g_autoptr(LaminaDocument) doc = NULL;
  g_autofree char *id = NULL;

  g_assert_no_error (error);
  g_clear_pointer (&wall->id, g_free);
  id = lamina_library_create_construction (library, wall, "tester", &error);
  g_assert_no_error (error);
  doc = lamina_document_new (library, id, &error);
  g_assert_no_error (error);

  /* An edit is saved at once. */
  lamina_document_apply (doc, lamina_edit_set_thickness (lamina_document_get_construction (doc), 1, 120, NULL),
                         NULL, LAMINA_APPLY_DEFAULT);
  stored = lamina_library_dup_construction (library, id, 0, &error);
  g_assert_no_error (error);
  g_assert_cmpfloat (layer_thickness (stored, 1), ==, 120);
  g_assert_cmpint (lamina_document_get_base_revision (doc), ==, stored->revision);

  /* Someone else saves through another connection... */
  other = lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING, &error);
  g_assert_no_error (error);
  theirs = lamina_library_dup_construction (other, id, 0, &error);
  ((LaminaLayer *) theirs->layers->pdata[0])->thickness = 15;
  g_assert_true (lamina_library_save_construction (other, theirs, theirs->revision, "other", &error));
  g_assert_no_error (error);

  /* ...so our next save is refused, and our state stays on screen. */
  lamina_document_apply (doc, lamina_edit_set_thickness (lamina_document_get_construction (doc), 1, 130, NULL),
                         NULL, LAMINA_APPLY_DEFAULT);
  g_assert_nonnull (lamina_document_get_conflict (doc));
  g_assert_cmpfloat (layer_thickness (lamina_document_get_construction (doc), 1), ==, 130);
  g_clear_pointer (&stored, lamina_construction_free);
  stored = lamina_library_dup_construction (library, id, 0, &error);
  g_assert_cmpfloat (layer_thickness (stored, 0), ==, 15);
  g_assert_cmpfloat (layer_thickness (stored, 1), ==, 120);

  /* Keeping ours puts it on top of theirs as a new revision. */
  g_assert_true (lamina_document_keep_mine (doc, &error));
  g_assert_no_error (error);
  g_assert_null (lamina_document_get_conflict (doc));
  g_clear_pointer (&stored, lamina_construction_free);
  stored = lamina_library_dup_construction (library, id, 0, &error);
  g_assert_cmpfloat (layer_thickness (stored, 1), ==, 130);
  g_assert_cmpint (stored->revision, ==, theirs->revision + 1);

  lamina_library_close (other);
  lamina_library_close (library);
  g_remove (path);
}

static void
test_construction_properties (void)
{
  g_autoptr(LaminaConstruction) wall = new_wall ();
  g_autoptr(LaminaConstruction) roof = NULL;
  g_autoptr(LaminaConstruction) steep = NULL;
  g_autoptr(LaminaConstruction) steep_ceiling = NULL;
  g_autoptr(LaminaConstruction) partition = NULL;
  g_autoptr(LaminaConstruction) indoor = NULL;
  g_autoptr(LaminaConstruction) tagged = NULL;
  g_autoptr(LaminaConstruction) untagged = NULL;
  g_autoptr(LaminaConstruction) noted = NULL;
  g_autoptr(LaminaResult) r_wall = NULL;
  g_autoptr(LaminaResult) r_roof = NULL;
  g_autoptr(LaminaResult) r_indoor = NULL;
  g_autoptr(GError) error = NULL;

  /* A wall at its default (horizontal) becomes a roof: the heat flow
   * follows to the roof's default, upward (EN ISO 6946:2017 6.8). */
  roof = lamina_edit_set_element (wall, LAMINA_ELEMENT_ROOF, &error);
  g_assert_no_error (error);
  g_assert_cmpint (wall->element, ==, LAMINA_ELEMENT_WALL);
  g_assert_cmpint (roof->element, ==, LAMINA_ELEMENT_ROOF);
  g_assert_cmpint (roof->heat_flow, ==, LAMINA_HEAT_FLOW_UPWARD);
  g_assert_cmpint (roof->outer_side, ==, LAMINA_OUTER_SIDE_OUTDOOR);
  /* Rsi 0.13 horizontal, 0.10 upward (EN ISO 6946:2017 Table 7). */
  r_wall = lamina_calculate (wall, &error);
  g_assert_no_error (error);
  r_roof = lamina_calculate (roof, &error);
  g_assert_no_error (error);
  g_assert_cmpfloat_with_epsilon (r_wall->rsi, 0.13, 1e-9);
  g_assert_cmpfloat_with_epsilon (r_roof->rsi, 0.10, 1e-9);

  /* A roof pitched over 60° has horizontal heat flow (flow within ±30° of
   * the horizontal, EN ISO 6946:2017 6.8): a direction the user chose is
   * kept when the element changes. */
  steep = lamina_edit_set_heat_flow (roof, LAMINA_HEAT_FLOW_HORIZONTAL, &error);
  g_assert_no_error (error);
  steep_ceiling = lamina_edit_set_element (steep, LAMINA_ELEMENT_CEILING, &error);
  g_assert_cmpint (steep_ceiling->heat_flow, ==, LAMINA_HEAT_FLOW_HORIZONTAL);
  g_assert_null (lamina_edit_set_heat_flow (roof, LAMINA_N_HEAT_FLOWS, NULL));

  /* A partition faces heated space on both sides (common practice; the
   * core's default for a new partition). */
  partition = lamina_edit_set_element (wall, LAMINA_ELEMENT_PARTITION, &error);
  g_assert_cmpint (partition->outer_side, ==, LAMINA_OUTER_SIDE_INDOOR);
  g_assert_cmpint (partition->heat_flow, ==, LAMINA_HEAT_FLOW_HORIZONTAL);

  /* Indoor outer side: Rse = Rsi (EN ISO 6946:2017 6.8). */
  indoor = lamina_edit_set_outer_side (wall, LAMINA_OUTER_SIDE_INDOOR, &error);
  g_assert_no_error (error);
  r_indoor = lamina_calculate (indoor, &error);
  g_assert_no_error (error);
  g_assert_cmpfloat_with_epsilon (r_indoor->rse, r_indoor->rsi, 1e-12);
  g_assert_cmpfloat_with_epsilon (r_wall->rse, 0.04, 1e-9);

  /* Tags: trimmed, no blank, no duplicate (letter case ignored). */
  tagged = lamina_edit_add_tag (wall, "  timber frame ", &error);
  g_assert_no_error (error);
  g_assert_cmpuint (tagged->tags->len, ==, 1);
  g_assert_cmpstr (tagged->tags->pdata[0], ==, "timber frame");
  g_assert_null (lamina_edit_add_tag (tagged, "Timber Frame", &error));
  g_assert_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID);
  g_assert_nonnull (strstr (error->message, "Tag"));
  g_clear_error (&error);
  g_assert_null (lamina_edit_add_tag (tagged, "   ", NULL));
  untagged = lamina_edit_remove_tag (tagged, "timber frame", &error);
  g_assert_no_error (error);
  g_assert_cmpuint (untagged->tags->len, ==, 0);
  g_assert_null (lamina_edit_remove_tag (untagged, "timber frame", NULL));

  noted = lamina_edit_set_notes (wall, "Check the vapour control layer on site.", &error);
  g_assert_no_error (error);
  g_assert_cmpstr (noted->notes, ==, "Check the vapour control layer on site.");
  g_clear_pointer (&noted, lamina_construction_free);
  noted = lamina_edit_set_notes (wall, "", &error);
  g_assert_null (noted->notes);
}

static void
test_local_date (void)
{
  /* The library keeps UTC (ISO 8601); people read their local date and
   * time.  The tests run with TZ=UTC and the C locale's month names. */
  g_autofree char *full = lamina_text_local_date ("2026-12-01T21:50:00Z");
  g_autofree char *day = lamina_text_local_date ("2026-06-09");
  g_autofree char *none = lamina_text_local_date (NULL);
  g_autofree char *bad = lamina_text_local_date ("yesterday");

  g_assert_cmpstr (full, ==, "1 Dec 2026, 21:50");
  g_assert_cmpstr (day, ==, "9 Jun 2026");
  g_assert_cmpstr (none, ==, "\xe2\x80\x94");
  g_assert_cmpstr (bad, ==, "yesterday");
}

int
main (int   argc,
      char *argv[])
{
  setlocale (LC_ALL, "C.UTF-8");
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/app/state/local-date", test_local_date);
  g_test_add_func ("/app/state/snap", test_snap);
  g_test_add_func ("/app/state/set-thickness-series", test_set_thickness_series);
  g_test_add_func ("/app/state/layer-stack", test_layer_stack);
  g_test_add_func ("/app/state/layer-kinds", test_layer_kinds);
  g_test_add_func ("/app/state/construction-properties", test_construction_properties);
  g_test_add_func ("/app/state/undo-stack", test_undo_stack);
  g_test_add_func ("/app/state/text", test_text);
  g_test_add_func ("/app/state/revision-diff", test_revision_diff);
  g_test_add_func ("/app/document/conflict", test_document_conflict);
  return g_test_run ();
}
