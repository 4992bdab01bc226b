/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The catalogue XML: the core vocabulary as the format defines it (issue 2
 * of the project), exact round trips, layer material snapshots, derived
 * figures that are never trusted, and atomic files. */
#include <glib.h>
#include <glib/gstdio.h>
#include <math.h>
#include <string.h>

#include "lamina-catalogue.h"

static char *
source_path (const char *first,
             ...)
{
  const char *top = g_getenv ("LAMINA_SOURCE_DIR");
  g_autoptr(GPtrArray) parts = g_ptr_array_new ();
  va_list args;

  g_ptr_array_add (parts, (gpointer) (top ? top : "."));
  va_start (args, first);
  for (const char *p = first; p != NULL; p = va_arg (args, const char *))
    g_ptr_array_add (parts, (gpointer) p);
  va_end (args);
  g_ptr_array_add (parts, NULL);
  return g_build_filenamev ((char **) parts->pdata);
}

static LaminaCatalogue *
read_or_die (const char *data,
             gsize       length)
{
  g_autoptr(GError) error = NULL;
  LaminaCatalogue *catalogue = lamina_catalogue_read_memory (data, length, "test.xml", &error);

  g_assert_no_error (error);
  g_assert_nonnull (catalogue);
  return catalogue;
}

static char *
write_or_die (const LaminaCatalogue *catalogue,
              LaminaWriteFlags       flags,
              gsize                 *length)
{
  g_autoptr(GError) error = NULL;
  char *text = lamina_catalogue_write_to_string (catalogue, flags, length, &error);

  g_assert_no_error (error);
  g_assert_nonnull (text);
  return text;
}

static LaminaLayer *
layer_at (const LaminaConstruction *c,
          guint                     index)
{
  g_assert_cmpuint (index, <, c->layers->len);
  return c->layers->pdata[index];
}

/* The example, read value by value. */
static void
test_core_example (void)
{
  g_autofree char *path = source_path ("tests", "exchange", "data", "core-example.xml", NULL);
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaCatalogue) catalogue = lamina_catalogue_read_file (path, &error);
  LaminaConstruction *c;
  LaminaLayer *layer;
  LaminaPart *part;

  g_assert_no_error (error);
  g_assert_cmpuint (catalogue->materials->len, ==, 4);
  c = lamina_catalogue_find (catalogue, "w1");
  g_assert_nonnull (c);
  g_assert_cmpint (c->element, ==, LAMINA_ELEMENT_WALL);
  g_assert_cmpint (c->heat_flow, ==, LAMINA_HEAT_FLOW_HORIZONTAL);
  g_assert_cmpint (c->outer_side, ==, LAMINA_OUTER_SIDE_OUTDOOR);
  g_assert_cmpint (c->status, ==, LAMINA_STATUS_DRAFT);
  g_assert_cmpuint (c->layers->len, ==, 5);

  layer = layer_at (c, 0);
  g_assert_cmpint (layer->kind, ==, LAMINA_LAYER_MATERIAL);
  g_assert_cmpfloat (layer->thickness, ==, 12.5);
  g_assert_cmpstr (layer->material->id, ==, "gyp");
  g_assert_cmpfloat (layer->material->conductivity, ==, 0.25);
  g_assert_cmpfloat (layer->material->density, ==, 900);
  g_assert_cmpfloat (layer->material->specific_heat, ==, 1000);
  g_assert_cmpfloat (layer->material->vapour_resistance_factor, ==, 10);
  g_assert_cmpint (layer->line, ==, 17);

  layer = layer_at (c, 1);
  g_assert_cmpint (layer->kind, ==, LAMINA_LAYER_BRIDGED);
  g_assert_cmpuint (layer->parts->len, ==, 2);
  part = layer->parts->pdata[0];
  g_assert_cmpstr (part->material->id, ==, "mw37");
  g_assert_true (isnan (lamina_part_get_given_fraction (part)));
  part = layer->parts->pdata[1];
  g_assert_cmpfloat (part->width, ==, 45);
  g_assert_cmpfloat (part->spacing, ==, 600);
  g_assert_cmpstr (part->member, ==, "stud");
  g_assert_cmpint (part->line, ==, 20);
  /* 45 / 600 = 0.075 for the studs, the rest for the mineral wool. */
  g_assert_cmpfloat_with_epsilon (lamina_layer_get_part_fraction (layer, 0), 0.925, 1e-12);

  layer = layer_at (c, 2);
  g_assert_cmpint (layer->kind, ==, LAMINA_LAYER_RESISTANCE);
  g_assert_cmpfloat (layer->resistance, ==, 0);

  layer = layer_at (c, 3);
  g_assert_cmpint (layer->kind, ==, LAMINA_LAYER_AIR);
  g_assert_cmpint (layer->air, ==, LAMINA_AIR_SLIGHTLY_VENTILATED);
  g_assert_cmpfloat (layer->vent_area, ==, 800);
  g_assert_cmpfloat (layer->emissivity_inner, ==, 0.9);
  g_assert_cmpfloat (layer->emissivity_outer, ==, 0.05);

  layer = layer_at (c, 4);
  g_assert_true (layer->corrections.has_air_gaps);
  g_assert_cmpint (layer->corrections.air_gap_level, ==, 1);
  g_assert_true (layer->corrections.has_fasteners);
  g_assert_cmpfloat (layer->corrections.fastener_conductivity, ==, 50);
  g_assert_cmpfloat (layer->corrections.fastener_cross_section, ==, 18.1);
  g_assert_cmpfloat (layer->corrections.fasteners_per_square_metre, ==, 6);
  g_assert_cmpfloat (layer->corrections.fastener_penetration, ==, 160);
  g_assert_true (layer->corrections.has_inverted_roof);
  g_assert_cmpfloat (layer->corrections.precipitation, ==, 2.0);
  g_assert_cmpfloat (layer->corrections.drainage_factor, ==, 0.5);
}

/* Defaults of heat-flow and outer-side, as the format defines them: wall
 * and partition horizontal, roof and ceiling upward, floor downward
 * (EN ISO 6946:2017 6.8); a partition faces indoors. */
static void
test_defaults (void)
{
  static const struct { const char *element; LaminaHeatFlow flow; LaminaOuterSide side; } expected[] = {
    { "wall", LAMINA_HEAT_FLOW_HORIZONTAL, LAMINA_OUTER_SIDE_OUTDOOR },
    { "roof", LAMINA_HEAT_FLOW_UPWARD, LAMINA_OUTER_SIDE_OUTDOOR },
    { "ceiling", LAMINA_HEAT_FLOW_UPWARD, LAMINA_OUTER_SIDE_OUTDOOR },
    { "floor", LAMINA_HEAT_FLOW_DOWNWARD, LAMINA_OUTER_SIDE_OUTDOOR },
    { "partition", LAMINA_HEAT_FLOW_HORIZONTAL, LAMINA_OUTER_SIDE_INDOOR },
  };

  for (guint i = 0; i < G_N_ELEMENTS (expected); i++)
    {
      g_autofree char *text = g_strdup_printf (
        "<catalogue xmlns=\"urn:x-lamina:catalogue:1\" format=\"1\">\n"
        "  <material id=\"c\" name=\"Concrete\" conductivity=\"2.0\"/>\n"
        "  <construction id=\"x\" name=\"X\" element=\"%s\">\n"
        "    <layer thickness=\"200\" material=\"c\"/>\n"
        "  </construction>\n"
        "</catalogue>\n", expected[i].element);
      g_autoptr(LaminaCatalogue) catalogue = read_or_die (text, strlen (text));
      LaminaConstruction *c = catalogue->constructions->pdata[0];

      g_assert_cmpint (c->heat_flow, ==, expected[i].flow);
      g_assert_cmpint (c->outer_side, ==, expected[i].side);
      g_assert_cmpfloat (c->inside_temperature, ==, 20);
      g_assert_cmpfloat (c->outside_temperature, ==, -10);
    }
}

/* Units through the file: mm in XML, R = d/λ with d in m (EN ISO 6946:2017
 * 6.7.1), Rsi 0.13 and Rse 0.04 for horizontal flow (Table 7). */
static void
test_units (void)
{
  static const char text[] =
    "<catalogue xmlns=\"urn:x-lamina:catalogue:1\" format=\"1\">\n"
    "  <material id=\"gyp\" name=\"Gypsum board\" conductivity=\"0.25\"/>\n"
    "  <material id=\"mw\" name=\"Mineral wool\" conductivity=\"0.035\"/>\n"
    "  <construction id=\"w\" name=\"W\" element=\"wall\">\n"
    "    <layer thickness=\"12.5\" material=\"gyp\"/>\n"
    "    <layer thickness=\"100\" material=\"mw\"/>\n"
    "    <layer thickness=\"1\" resistance=\"0.25\"/>\n"
    "  </construction>\n"
    "</catalogue>\n";
  g_autoptr(LaminaCatalogue) catalogue = read_or_die (text, sizeof text - 1);
  g_autoptr(LaminaResult) result = lamina_calculate (catalogue->constructions->pdata[0], NULL);
  double expected = 0.13 + 0.0125 / 0.25 + 0.100 / 0.035 + 0.25 + 0.04;

  g_assert_nonnull (result);
  g_assert_cmpfloat_with_epsilon (result->r_total, expected, 1e-9);
  g_assert_cmpfloat_with_epsilon (result->u, 1.0 / expected, 1e-9);
}

static LaminaMaterial *
material (const char     *id,
          const char     *name,
          LaminaCategory  category,
          double          conductivity)
{
  return lamina_material_new (id, name, category, conductivity);
}

/* A construction using every field of the model. */
static LaminaConstruction *
build_everything (void)
{
  LaminaConstruction *c = lamina_construction_new ("ww-07", "Timber frame wall, \"ventilated\" <cladding> & render",
                                                   LAMINA_ELEMENT_WALL);
  LaminaMaterial *gyp = material ("gyp", "Gypsum board", LAMINA_CATEGORY_BOARD, 0.25);
  LaminaLayer *layer;
  const double stock[] = { 15, 9.5, 12.5 };

  lamina_material_set_stock_thicknesses (gyp, stock, G_N_ELEMENTS (stock));
  gyp->density = 900;
  gyp->specific_heat = 1000;
  gyp->vapour_resistance_factor = 10;
  gyp->emissivity = 0.9;
  gyp->source = g_strdup ("EN ISO 10456 Table 3");
  gyp->notes = g_strdup ("two lines\nand a\ttab, a CR\r\nand ünïcödé ✓");
  c->code = g_strdup ("W-07");
  c->description = g_strdup ("  leading blanks kept\n\n  and blank lines  ");
  c->notes = g_strdup ("Check the sd value of the membrane on site.");
  lamina_construction_add_tag (c, "timber frame");
  lamina_construction_add_tag (c, "Passivhaus <candidate>");
  c->target_u = 0.18;
  c->inside_temperature = 21.5;
  c->outside_temperature = -12.3;
  c->status = LAMINA_STATUS_APPROVED;
  c->revision = 4;
  c->modified_by = g_strdup ("M. Osei");
  c->modified_at = g_strdup ("2025-02-11T09:30:00Z");
  c->checked_by = g_strdup ("R. Janssen");
  c->checked_at = g_strdup ("2025-02-12 14:05:10");
  c->approved_by = g_strdup ("K. Brandt");
  c->approved_at = g_strdup ("2025-02-14");

  layer = lamina_layer_new_material (12.5, gyp);
  layer->note = g_strdup ("screwed at 300 mm");
  lamina_construction_add_layer (c, layer);

  layer = lamina_layer_new_bridged (145);
  lamina_layer_add_part (layer, lamina_part_new (material ("mw", "Mineral wool", LAMINA_CATEGORY_INSULATION, 0.035), NAN));
  lamina_layer_add_part (layer, lamina_part_new_framing (material ("sw", "Softwood", LAMINA_CATEGORY_TIMBER, 0.13),
                                                         45, 600, "stud"));
  layer->corrections.has_air_gaps = TRUE;
  layer->corrections.air_gap_level = 1;
  lamina_construction_add_layer (c, layer);

  layer = lamina_layer_new_bridged (1.0 / 3.0 * 100);
  lamina_layer_add_part (layer, lamina_part_new (NULL, 0.1 + 0.2));
  lamina_layer_add_part (layer, lamina_part_new (material ("sw", "Softwood", LAMINA_CATEGORY_TIMBER, 0.13), NAN));
  lamina_construction_add_layer (c, layer);

  lamina_construction_add_layer (c, lamina_layer_new_resistance (0.2, 0.0));

  layer = lamina_layer_new_air (25, LAMINA_AIR_SLIGHTLY_VENTILATED);
  layer->vent_area = 800;
  layer->emissivity_outer = 0.05;
  lamina_construction_add_layer (c, layer);

  layer = lamina_layer_new_material (60, material ("wf", "Wood fibre board", LAMINA_CATEGORY_INSULATION, 0.045));
  layer->corrections.has_fasteners = TRUE;
  layer->corrections.fastener_conductivity = 17;
  layer->corrections.fastener_cross_section = 12.6;
  layer->corrections.fasteners_per_square_metre = 8;
  layer->corrections.fastener_penetration = 50;
  layer->corrections.has_inverted_roof = TRUE;
  layer->corrections.precipitation = 2.1;
  layer->corrections.drainage_factor = 0.75;
  lamina_construction_add_layer (c, layer);
  return c;
}

static void
assert_library_data_equal (const LaminaConstruction *a,
                           const LaminaConstruction *b)
{
  g_assert_cmpint (a->status, ==, b->status);
  g_assert_cmpint (a->revision, ==, b->revision);
  g_assert_cmpstr (a->modified_by, ==, b->modified_by);
  g_assert_cmpstr (a->modified_at, ==, b->modified_at);
  g_assert_cmpstr (a->checked_by, ==, b->checked_by);
  g_assert_cmpstr (a->checked_at, ==, b->checked_at);
  g_assert_cmpstr (a->approved_by, ==, b->approved_by);
  g_assert_cmpstr (a->approved_at, ==, b->approved_at);
}

static void
assert_same_figures (const LaminaConstruction *a,
                     const LaminaConstruction *b)
{
  g_autoptr(LaminaResult) ra = lamina_calculate (a, NULL);
  g_autoptr(LaminaResult) rb = lamina_calculate (b, NULL);

  g_assert_nonnull (ra);
  g_assert_nonnull (rb);
  /* Exact: the same doubles go in, so the same doubles come out. */
  g_assert_cmpfloat (ra->r_upper, ==, rb->r_upper);
  g_assert_cmpfloat (ra->r_lower, ==, rb->r_lower);
  g_assert_cmpfloat (ra->r_total, ==, rb->r_total);
  g_assert_cmpfloat (ra->u, ==, rb->u);
  g_assert_cmpfloat (ra->delta_u, ==, rb->delta_u);
  g_assert_cmpfloat (ra->u_corrected, ==, rb->u_corrected);
}

static void
test_round_trip (void)
{
  g_autoptr(LaminaCatalogue) catalogue = lamina_catalogue_new ();
  g_autoptr(LaminaCatalogue) back = NULL;
  g_autofree char *text = NULL, *again = NULL;
  LaminaConstruction *c = build_everything ();
  gsize length, length_again;

  catalogue->title = g_strdup ("Atelier Nordlicht — office library");
  g_ptr_array_add (catalogue->constructions, c);
  g_ptr_array_add (catalogue->constructions,
                   lamina_construction_new ("empty-ish", "Partition", LAMINA_ELEMENT_PARTITION));
  lamina_construction_add_layer (catalogue->constructions->pdata[1],
                                 lamina_layer_new_material (100, material ("cls", "Calcium silicate", LAMINA_CATEGORY_MASONRY, 0.5)));

  text = write_or_die (catalogue, LAMINA_WRITE_DEFAULT, &length);
  g_assert_cmpuint (length, ==, strlen (text));
  g_test_message ("%s", text);
  back = read_or_die (text, length);
  g_assert_cmpstr (back->title, ==, catalogue->title);
  g_assert_cmpuint (back->constructions->len, ==, 2);
  for (guint i = 0; i < 2; i++)
    {
      g_assert_true (lamina_construction_equal_content (catalogue->constructions->pdata[i],
                                                        back->constructions->pdata[i]));
      assert_library_data_equal (catalogue->constructions->pdata[i], back->constructions->pdata[i]);
      assert_same_figures (catalogue->constructions->pdata[i], back->constructions->pdata[i]);
    }
  /* Materials that layers use become library materials of the document. */
  g_assert_cmpuint (back->materials->len, ==, 5);
  g_assert_nonnull (lamina_catalogue_find_material (back, "sw"));

  /* Writing what was read gives the same bytes. */
  again = write_or_die (back, LAMINA_WRITE_DEFAULT, &length_again);
  g_assert_cmpstr (again, ==, text);
}

/* Numbers are written as they were typed, and any double survives. */
static void
test_numbers (void)
{
  g_autoptr(LaminaCatalogue) catalogue = lamina_catalogue_new ();
  g_autofree char *text = NULL;
  LaminaConstruction *c = lamina_construction_new ("n", "Numbers", LAMINA_ELEMENT_ROOF);

  lamina_construction_add_layer (c, lamina_layer_new_material (12.5, material ("a", "A", LAMINA_CATEGORY_OTHER, 0.035)));
  lamina_construction_add_layer (c, lamina_layer_new_material (0.1 + 0.2, material ("b", "B", LAMINA_CATEGORY_OTHER, 1e-3)));
  g_ptr_array_add (catalogue->constructions, c);
  text = write_or_die (catalogue, LAMINA_WRITE_DEFAULT, NULL);
  g_assert_nonnull (strstr (text, "thickness=\"12.5\""));
  g_assert_nonnull (strstr (text, "conductivity=\"0.035\""));
  g_assert_nonnull (strstr (text, "conductivity=\"0.001\""));
  g_assert_nonnull (strstr (text, "thickness=\"0.30000000000000004\""));
}

/* A layer keeps the λ it was calculated with, even when the library
 * material of that id has changed since (issue 3 of the project). */
static void
test_snapshots (void)
{
  g_autoptr(LaminaCatalogue) catalogue = lamina_catalogue_new ();
  g_autoptr(LaminaCatalogue) back = NULL;
  g_autofree char *text = NULL;
  LaminaConstruction *old = lamina_construction_new ("old", "Reviewed last year", LAMINA_ELEMENT_WALL);
  LaminaConstruction *now = lamina_construction_new ("now", "New", LAMINA_ELEMENT_WALL);

  g_ptr_array_add (catalogue->materials, material ("mw", "Mineral wool", LAMINA_CATEGORY_INSULATION, 0.032));
  lamina_construction_add_layer (old, lamina_layer_new_material (100, material ("mw", "Mineral wool", LAMINA_CATEGORY_INSULATION, 0.035)));
  lamina_construction_add_layer (old, lamina_layer_new_material (50, material ("mw", "Mineral wool", LAMINA_CATEGORY_INSULATION, 0.035)));
  lamina_construction_add_layer (now, lamina_layer_new_material (100, material ("mw", "Mineral wool", LAMINA_CATEGORY_INSULATION, 0.032)));
  lamina_construction_add_layer (now, lamina_layer_new_material (20, material ("mw", "Mineral wool", LAMINA_CATEGORY_INSULATION, 0.040)));
  g_ptr_array_add (catalogue->constructions, old);
  g_ptr_array_add (catalogue->constructions, now);

  text = write_or_die (catalogue, LAMINA_WRITE_DEFAULT, NULL);
  g_test_message ("%s", text);
  g_assert_nonnull (strstr (text, "<material id=\"mw~2\" snapshot-of=\"mw\""));
  g_assert_nonnull (strstr (text, "<material id=\"mw~3\" snapshot-of=\"mw\""));
  g_assert_null (strstr (text, "mw~4"));
  back = read_or_die (text, strlen (text));
  g_assert_cmpuint (back->materials->len, ==, 1);
  g_assert_cmpfloat (lamina_catalogue_find_material (back, "mw")->conductivity, ==, 0.032);
  for (guint i = 0; i < 2; i++)
    {
      g_assert_true (lamina_construction_equal_content (catalogue->constructions->pdata[i],
                                                        back->constructions->pdata[i]));
      assert_same_figures (catalogue->constructions->pdata[i], back->constructions->pdata[i]);
    }
  g_assert_cmpstr (layer_at (back->constructions->pdata[0], 0)->material->id, ==, "mw");
  g_assert_cmpfloat (layer_at (back->constructions->pdata[0], 0)->material->conductivity, ==, 0.035);
}

static double
derived_value (const char *text,
               const char *attr)
{
  g_autofree char *key = g_strdup_printf (" %s=\"", attr);
  const char *derived = strstr (text, "<derived");
  const char *at;

  g_assert_nonnull (derived);
  at = strstr (derived, key);
  g_assert_nonnull (at);
  return g_ascii_strtod (at + strlen (key), NULL);
}

/* <derived> carries the engine's figures, and a reader never trusts it. */
static void
test_derived (void)
{
  g_autofree char *path = source_path ("tests", "exchange", "data", "core-example.xml", NULL);
  g_autoptr(LaminaCatalogue) catalogue = lamina_catalogue_read_file (path, NULL);
  g_autoptr(LaminaResult) result = NULL;
  g_autoptr(LaminaResult) recomputed = NULL;
  g_autoptr(LaminaCatalogue) back = NULL;
  g_autoptr(GRegex) regex = NULL;
  g_autofree char *text = NULL, *tampered = NULL, *plain = NULL;

  g_assert_nonnull (catalogue);
  result = lamina_calculate (catalogue->constructions->pdata[0], NULL);
  text = write_or_die (catalogue, LAMINA_WRITE_DERIVED, NULL);
  g_assert_cmpfloat (derived_value (text, "r-upper"), ==, result->r_upper);
  g_assert_cmpfloat (derived_value (text, "r-lower"), ==, result->r_lower);
  g_assert_cmpfloat (derived_value (text, "r-total"), ==, result->r_total);
  g_assert_cmpfloat (derived_value (text, "relative-error"), ==, result->relative_error);
  g_assert_cmpfloat (derived_value (text, "u"), ==, result->u);
  g_assert_cmpfloat (derived_value (text, "delta-u"), ==, result->delta_u);
  g_assert_cmpfloat (derived_value (text, "u-corrected"), ==, result->u_corrected);
  g_assert_cmpfloat (derived_value (text, "rsi"), ==, result->rsi);
  g_assert_cmpfloat (derived_value (text, "rse"), ==, result->rse);
  plain = write_or_die (catalogue, LAMINA_WRITE_DEFAULT, NULL);
  g_assert_null (strstr (plain, "<derived"));

  /* Claim a far better wall. */
  regex = g_regex_new (" (u|u-corrected|r-total)=\"[^\"]*\"", 0, 0, NULL);
  tampered = g_regex_replace (regex, text, -1, 0, " \\1=\"0.001\"", 0, NULL);
  g_assert_cmpstr (tampered, !=, text);
  back = read_or_die (tampered, strlen (tampered));
  recomputed = lamina_calculate (back->constructions->pdata[0], NULL);
  g_assert_cmpfloat (recomputed->u, ==, result->u);
  g_assert_cmpfloat (recomputed->u_corrected, ==, result->u_corrected);
  g_assert_cmpfloat (recomputed->r_total, ==, result->r_total);
}

/* The writer refuses what its reader would refuse, instead of writing a
 * document nobody can open. */
static void
test_write_refuses (void)
{
  g_autoptr(LaminaCatalogue) catalogue = lamina_catalogue_new ();
  g_autoptr(GError) error = NULL;
  LaminaConstruction *c = lamina_construction_new ("bad", "Bad", LAMINA_ELEMENT_WALL);
  LaminaLayer *layer = lamina_layer_new_material (0, material ("a", "A", LAMINA_CATEGORY_OTHER, 0.2));

  lamina_construction_add_layer (c, layer);
  g_ptr_array_add (catalogue->constructions, c);
  g_assert_null (lamina_catalogue_write_to_string (catalogue, 0, NULL, &error));
  g_assert_error (error, LAMINA_XML_ERROR, LAMINA_XML_ERROR_INVALID);
  g_assert_nonnull (strstr (error->message, "construction “bad”"));
  g_assert_nonnull (strstr (error->message, "thickness"));
  g_clear_error (&error);

  layer->thickness = 10;
  g_free (c->name);
  c->name = g_strdup ("bell \a character");
  g_assert_null (lamina_catalogue_write_to_string (catalogue, 0, NULL, &error));
  g_assert_nonnull (strstr (error->message, "U+0007"));
  g_clear_error (&error);

  g_free (c->name);
  c->name = g_strdup ("fine");
  c->approved_at = g_strdup ("last Tuesday");
  g_assert_null (lamina_catalogue_write_to_string (catalogue, 0, NULL, &error));
  g_assert_nonnull (strstr (error->message, "last Tuesday"));
}

/* Files are replaced whole (temporary file, then rename), and a failed
 * write leaves the old file as it was. */
static void
test_write_file (void)
{
  g_autofree char *dir = g_dir_make_tmp (NULL, NULL);
  g_autofree char *path = g_build_filename (dir, "out.xml", NULL);
  g_autofree char *nowhere = g_build_filename (dir, "missing", "out.xml", NULL);
  g_autofree char *before = NULL, *after = NULL;
  g_autoptr(LaminaCatalogue) catalogue = lamina_catalogue_new ();
  g_autoptr(LaminaCatalogue) back = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(GDir) listing = NULL;
  LaminaConstruction *c = lamina_construction_new ("f", "Floor", LAMINA_ELEMENT_FLOOR);

  lamina_construction_add_layer (c, lamina_layer_new_material (150, material ("c", "Concrete", LAMINA_CATEGORY_CONCRETE, 2.0)));
  g_ptr_array_add (catalogue->constructions, c);
  g_assert_true (lamina_catalogue_write_file (catalogue, path, LAMINA_WRITE_DERIVED, &error));
  g_assert_no_error (error);
  g_assert_true (lamina_catalogue_write_file (catalogue, path, 0, &error));
  back = lamina_catalogue_read_file (path, &error);
  g_assert_no_error (error);
  g_assert_true (lamina_construction_equal_content (c, back->constructions->pdata[0]));

  /* An invalid catalogue: nothing is written, the old file stays. */
  g_assert_true (g_file_get_contents (path, &before, NULL, NULL));
  layer_at (c, 0)->thickness = -1;
  g_assert_false (lamina_catalogue_write_file (catalogue, path, 0, &error));
  g_clear_error (&error);
  g_assert_true (g_file_get_contents (path, &after, NULL, NULL));
  g_assert_cmpstr (before, ==, after);

  layer_at (c, 0)->thickness = 150;
  g_assert_false (lamina_catalogue_write_file (catalogue, nowhere, 0, &error));
  g_assert_error (error, LAMINA_XML_ERROR, LAMINA_XML_ERROR_IO);

  /* No temporary file is left beside the target. */
  listing = g_dir_open (dir, 0, NULL);
  g_assert_cmpstr (g_dir_read_name (listing), ==, "out.xml");
  g_assert_null (g_dir_read_name (listing));
  g_unlink (path);
  g_rmdir (dir);
}

/* Every shipped example reads, calculates, and survives a round trip. */
static void
test_examples (void)
{
  g_autofree char *dir_path = source_path ("data", "examples", NULL);
  g_autoptr(GDir) dir = g_dir_open (dir_path, 0, NULL);
  const char *name;
  guint n = 0;

  g_assert_nonnull (dir);
  while ((name = g_dir_read_name (dir)) != NULL)
    {
      g_autofree char *path = g_build_filename (dir_path, name, NULL);
      g_autoptr(GError) error = NULL;
      g_autoptr(LaminaCatalogue) catalogue = NULL;
      g_autoptr(LaminaCatalogue) back = NULL;
      g_autofree char *text = NULL;

      if (!g_str_has_suffix (name, ".xml"))
        continue;
      catalogue = lamina_catalogue_read_file (path, &error);
      g_assert_no_error (error);
      g_assert_cmpuint (catalogue->constructions->len, >, 0);
      text = write_or_die (catalogue, LAMINA_WRITE_DERIVED, NULL);
      back = read_or_die (text, strlen (text));
      for (guint i = 0; i < catalogue->constructions->len; i++)
        {
          g_assert_true (lamina_construction_equal_content (catalogue->constructions->pdata[i],
                                                            back->constructions->pdata[i]));
          assert_same_figures (catalogue->constructions->pdata[i], back->constructions->pdata[i]);
        }
      n++;
    }
  g_assert_cmpuint (n, >=, 3);
}

/* EN ISO 13788 input through the XML: a climate of twelve months, the
 * moisture settings of a construction (a humidity class, or a fixed φi and
 * θi) and a foil's declared sd survive a write and a read exactly, and the
 * climates come after the materials and before the constructions. */
static const char moisture_document[] =
  "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n"
  "<catalogue xmlns=\"urn:x-lamina:catalogue:1\" format=\"1\">\n"
  "  <material id=\"gyp\" name=\"Gypsum board\" conductivity=\"0.25\" vapour-resistance-factor=\"10\"/>\n"
  "  <material id=\"mw\" name=\"Mineral wool\" conductivity=\"0.035\" vapour-resistance-factor=\"1\"/>\n"
  "  <material id=\"pe\" name=\"Polyethylene foil\" conductivity=\"0.4\"/>\n"
  "  <construction id=\"w1\" name=\"Wall\" element=\"wall\">\n"
  "    <layer thickness=\"12.5\" material=\"gyp\"/>\n"
  "    <layer thickness=\"0.2\" material=\"pe\" sd=\"50\"/>\n"
  "    <layer thickness=\"150\" material=\"mw\"/>\n"
  "    <moisture climate=\"coast\" humidity-class=\"3\"/>\n"
  "  </construction>\n"
  "  <construction id=\"w2\" name=\"Wall 2\" element=\"wall\">\n"
  "    <layer thickness=\"150\" material=\"mw\"/>\n"
  "    <moisture climate=\"coast\" inside-humidity=\"0.55\" inside-temperature=\"21.5\"/>\n"
  "  </construction>\n"
  "  <climate id=\"coast\" name=\"Coast (invented)\" source=\"invented for a test\">\n"
  "    <month number=\"2\" temperature=\"-0.5\" humidity=\"0.9\"/>\n"
  "    <month number=\"1\" temperature=\"-1.25\" humidity=\"0.91\"/>\n"
  "    <month number=\"3\" temperature=\"2\" humidity=\"0.85\"/>\n"
  "    <month number=\"4\" temperature=\"6\" humidity=\"0.8\"/>\n"
  "    <month number=\"5\" temperature=\"11\" humidity=\"0.75\"/>\n"
  "    <month number=\"6\" temperature=\"15\" humidity=\"0.75\"/>\n"
  "    <month number=\"7\" temperature=\"17\" humidity=\"0.76\"/>\n"
  "    <month number=\"8\" temperature=\"17\" humidity=\"0.78\"/>\n"
  "    <month number=\"9\" temperature=\"13.5\" humidity=\"0.8\"/>\n"
  "    <month number=\"10\" temperature=\"9\" humidity=\"0.84\"/>\n"
  "    <month number=\"11\" temperature=\"4\" humidity=\"0.88\"/>\n"
  "    <month number=\"12\" temperature=\"0.5\" humidity=\"0.9\"/>\n"
  "  </climate>\n"
  "</catalogue>\n";

static void
test_moisture_round_trip (void)
{
  g_autoptr(LaminaCatalogue) a = read_or_die (moisture_document, sizeof moisture_document - 1);
  g_autoptr(LaminaCatalogue) b = NULL;
  g_autofree char *text = NULL;
  g_autofree char *again = NULL;
  gsize length, length_again;
  LaminaClimate *climate;
  LaminaConstruction *c;

  g_assert_cmpuint (a->climates->len, ==, 1);
  climate = lamina_catalogue_find_climate (a, "coast");
  g_assert_nonnull (climate);
  g_assert_cmpstr (climate->source, ==, "invented for a test");
  g_assert_cmpfloat (climate->temperature[0], ==, -1.25);
  g_assert_cmpfloat (climate->humidity[1], ==, 0.9);
  c = lamina_catalogue_find (a, "w1");
  g_assert_nonnull (c->moisture);
  g_assert_cmpstr (c->moisture->climate, ==, "coast");
  g_assert_cmpint (c->moisture->humidity_class, ==, 3);
  g_assert_true (isnan (c->moisture->inside_humidity));
  g_assert_cmpfloat (layer_at (c, 1)->sd, ==, 50);
  g_assert_true (isnan (layer_at (c, 0)->sd));
  c = lamina_catalogue_find (a, "w2");
  g_assert_cmpfloat (c->moisture->inside_humidity, ==, 0.55);
  g_assert_cmpfloat (c->moisture->inside_temperature, ==, 21.5);

  text = write_or_die (a, LAMINA_WRITE_DEFAULT, &length);
  /* order: materials, climates, constructions; the moisture after the layers */
  g_assert_true (strstr (text, "<material id=\"pe\"") < strstr (text, "<climate"));
  g_assert_true (strstr (text, "</climate>") < strstr (text, "<construction"));
  g_assert_true (strstr (text, "<moisture climate=\"coast\" humidity-class=\"3\"/>") > strstr (text, "sd=\"50\""));
  b = read_or_die (text, length);
  g_assert_cmpuint (b->climates->len, ==, 1);
  g_assert_true (lamina_climate_equal (a->climates->pdata[0], b->climates->pdata[0]));
  for (guint i = 0; i < a->constructions->len; i++)
    g_assert_true (lamina_construction_equal_content (a->constructions->pdata[i], b->constructions->pdata[i]));
  again = write_or_die (b, LAMINA_WRITE_DEFAULT, &length_again);
  g_assert_cmpstr (text, ==, again);
}

/* The writer refuses what the reader would: a construction whose climate is
 * not in the catalogue. */
static void
test_moisture_write_refuses (void)
{
  g_autoptr(LaminaCatalogue) a = read_or_die (moisture_document, sizeof moisture_document - 1);
  g_autoptr(GError) error = NULL;
  g_autofree char *text = NULL;

  g_ptr_array_remove_index (a->climates, 0);
  text = lamina_catalogue_write_to_string (a, LAMINA_WRITE_DEFAULT, NULL, &error);
  g_assert_null (text);
  g_assert_error (error, LAMINA_XML_ERROR, LAMINA_XML_ERROR_INVALID);
  g_assert_nonnull (strstr (error->message, "unknown climate “coast”"));
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/exchange/read/core-example", test_core_example);
  g_test_add_func ("/exchange/read/defaults", test_defaults);
  g_test_add_func ("/exchange/read/units", test_units);
  g_test_add_func ("/exchange/round-trip/everything", test_round_trip);
  g_test_add_func ("/exchange/round-trip/snapshots", test_snapshots);
  g_test_add_func ("/exchange/write/numbers", test_numbers);
  g_test_add_func ("/exchange/write/refuses-invalid", test_write_refuses);
  g_test_add_func ("/exchange/write/file", test_write_file);
  g_test_add_func ("/exchange/derived/ignored-on-read", test_derived);
  g_test_add_func ("/exchange/examples", test_examples);
  g_test_add_func ("/exchange/round-trip/moisture", test_moisture_round_trip);
  g_test_add_func ("/exchange/write/refuses-unknown-climate", test_moisture_write_refuses);
  return g_test_run ();
}
