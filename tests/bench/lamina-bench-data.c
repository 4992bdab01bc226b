/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-bench-data.c: synthetic constructions for the benchmarks, made
 * from a seed.  An invented practice's library: the words are ours, the
 * conductivities are typical design values (common practice, from
 * memory); nothing here is a checked reference value. */
#define G_LOG_DOMAIN "lamina-bench"

#include "lamina-bench.h"

#include <math.h>

typedef struct
{
  const char     *id;
  const char     *name;
  LaminaCategory  category;
  double          conductivity;  /* W/(m·K) */
  double          density;       /* kg/m³ */
} BenchMaterial;

enum
{
  M_GYPSUM, M_OSB, M_SOFTWOOD, M_MINERAL_WOOL, M_WOOD_FIBRE, M_PIR, M_EPS,
  M_BRICK, M_CONCRETE, M_LIME_PLASTER, M_SCREED, M_MEMBRANE, M_SLATE,
  M_CLAY_BLOCK, M_CORK, M_LARCH, N_MATERIALS
};

static const BenchMaterial materials[N_MATERIALS] = {
  [M_GYPSUM]       = { "bench-gypsum-board",   "Gypsum board",            LAMINA_CATEGORY_BOARD,      0.25,  900 },
  [M_OSB]          = { "bench-osb",            "Oriented strand board",   LAMINA_CATEGORY_BOARD,      0.13,  650 },
  [M_SOFTWOOD]     = { "bench-softwood",       "Softwood framing",        LAMINA_CATEGORY_TIMBER,     0.13,  500 },
  [M_MINERAL_WOOL] = { "bench-mineral-wool",   "Mineral wool batt",       LAMINA_CATEGORY_INSULATION, 0.035, 30 },
  [M_WOOD_FIBRE]   = { "bench-wood-fibre",     "Wood fibre board",        LAMINA_CATEGORY_INSULATION, 0.042, 160 },
  [M_PIR]          = { "bench-pir",            "PIR board",               LAMINA_CATEGORY_INSULATION, 0.022, 32 },
  [M_EPS]          = { "bench-eps",            "Expanded polystyrene",    LAMINA_CATEGORY_INSULATION, 0.032, 20 },
  [M_BRICK]        = { "bench-clay-brick",     "Clay facing brick",       LAMINA_CATEGORY_MASONRY,    0.77,  1700 },
  [M_CONCRETE]     = { "bench-concrete",       "Reinforced concrete",     LAMINA_CATEGORY_CONCRETE,   2.3,   2300 },
  [M_LIME_PLASTER] = { "bench-lime-plaster",   "Lime plaster",            LAMINA_CATEGORY_PLASTER,    0.7,   1600 },
  [M_SCREED]       = { "bench-screed",         "Cement screed",           LAMINA_CATEGORY_CONCRETE,   1.4,   2000 },
  [M_MEMBRANE]     = { "bench-vapour-control", "Vapour control membrane", LAMINA_CATEGORY_MEMBRANE,   0.4,   980 },
  [M_SLATE]        = { "bench-slate",          "Natural slate",           LAMINA_CATEGORY_STONE,      2.2,   2700 },
  [M_CLAY_BLOCK]   = { "bench-clay-block",     "Perforated clay block",   LAMINA_CATEGORY_MASONRY,    0.12,  750 },
  [M_CORK]         = { "bench-cork",           "Expanded cork board",     LAMINA_CATEGORY_INSULATION, 0.040, 110 },
  [M_LARCH]        = { "bench-larch",          "Larch cladding",          LAMINA_CATEGORY_TIMBER,     0.13,  550 },
};

static const char *const projects[] = {
  "Millbrook school", "Quayside housing", "Orchard Lane terrace", "Hollins library",
  "Fernhill care home", "Tannery lofts", "Westgate offices", "Larkspur nursery",
};
static const char *const tags[] = {
  "new-build", "retrofit", "passive", "acoustic", "fire-rated", "heritage", "timber", "masonry",
};

static LaminaMaterial *
dup_material (guint which)
{
  const BenchMaterial *b = &materials[which];
  LaminaMaterial *m = lamina_material_new (b->id, b->name, b->category, b->conductivity);

  m->density = b->density;
  m->source = g_strdup ("typical design value (common practice)");
  return m;
}

GPtrArray *
lamina_bench_dup_materials (void)
{
  GPtrArray *all = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_material_free);

  for (guint i = 0; i < N_MATERIALS; i++)
    g_ptr_array_add (all, dup_material (i));
  return all;
}

static void
add (LaminaConstruction *c,
     guint               which,
     double              thickness)
{
  lamina_construction_add_layer (c, lamina_layer_new_material (thickness, dup_material (which)));
}

/* Insulation between framing members: the bridged layer of timber builds. */
static void
add_framed (LaminaConstruction *c,
            guint               insulation,
            double              thickness,
            double              spacing,
            const char         *member)
{
  LaminaLayer *l = lamina_layer_new_bridged (thickness);

  lamina_layer_add_part (l, lamina_part_new (dup_material (insulation), NAN));
  lamina_layer_add_part (l, lamina_part_new_framing (dup_material (M_SOFTWOOD), 45, spacing, member));
  lamina_construction_add_layer (c, l);
}

static double
pick (GRand  *rand,
      double  lo,
      double  hi,
      double  step)
{
  return lo + step * g_rand_int_range (rand, 0, (int) ((hi - lo) / step) + 1);
}

static void
build_wall (LaminaConstruction *c,
            GRand              *rand)
{
  if (g_rand_boolean (rand))
    {
      /* Timber frame: lining, service void, studs, sheathing, cladding. */
      add (c, M_GYPSUM, 12.5);
      if (g_rand_boolean (rand))
        add (c, M_GYPSUM, 12.5);
      add (c, M_MEMBRANE, 0.2);
      add_framed (c, M_MINERAL_WOOL, pick (rand, 90, 240, 5), 600, "stud");
      if (g_rand_boolean (rand))
        add_framed (c, M_WOOD_FIBRE, pick (rand, 40, 100, 20), 625, "batten");
      add (c, M_OSB, pick (rand, 9, 18, 3));
      add (c, M_WOOD_FIBRE, pick (rand, 40, 120, 20));
      lamina_construction_add_layer (c, lamina_layer_new_air (25, LAMINA_AIR_UNVENTILATED));
      add (c, M_LARCH, 22);
    }
  else
    {
      /* Masonry cavity wall. */
      add (c, M_LIME_PLASTER, 15);
      add (c, g_rand_boolean (rand) ? M_CLAY_BLOCK : M_CONCRETE, pick (rand, 100, 240, 10));
      add (c, g_rand_boolean (rand) ? M_PIR : M_MINERAL_WOOL, pick (rand, 80, 200, 10));
      lamina_construction_add_layer (c, lamina_layer_new_air (pick (rand, 25, 50, 5), LAMINA_AIR_UNVENTILATED));
      add (c, M_BRICK, 102.5);
    }
}

static void
build_roof (LaminaConstruction *c,
            GRand              *rand)
{
  add (c, M_GYPSUM, 12.5);
  add (c, M_MEMBRANE, 0.2);
  add_framed (c, M_MINERAL_WOOL, pick (rand, 150, 250, 10), 400, "rafter");
  add (c, M_WOOD_FIBRE, pick (rand, 40, 100, 20));
  add (c, M_MEMBRANE, 0.5);
  lamina_construction_add_layer (c, lamina_layer_new_air (pick (rand, 25, 50, 5), LAMINA_AIR_UNVENTILATED));
  add (c, M_SLATE, 8);
}

static void
build_floor (LaminaConstruction *c,
             GRand              *rand)
{
  /* Floors are drawn and calculated inside first (the screed on top). */
  add (c, M_SCREED, pick (rand, 50, 75, 5));
  add (c, M_MEMBRANE, 0.2);
  add (c, g_rand_boolean (rand) ? M_EPS : M_PIR, pick (rand, 80, 200, 10));
  add (c, M_CONCRETE, pick (rand, 150, 250, 10));
}

static void
build_ceiling (LaminaConstruction *c,
               GRand              *rand)
{
  add (c, M_GYPSUM, 12.5);
  add_framed (c, M_MINERAL_WOOL, pick (rand, 100, 300, 20), 600, "joist");
  add (c, M_OSB, 18);
}

static void
build_partition (LaminaConstruction *c,
                 GRand              *rand)
{
  add (c, M_GYPSUM, 12.5);
  add_framed (c, g_rand_boolean (rand) ? M_MINERAL_WOOL : M_CORK, pick (rand, 50, 100, 25), 600, "stud");
  add (c, M_GYPSUM, 12.5);
}

LaminaConstruction *
lamina_bench_make_construction (guint32 seed,
                                guint   index)
{
  static const char *const codes[] = { "EW", "RF", "FL", "CE", "PT" };
  static const char *const kinds[] = { "wall", "roof", "floor", "ceiling", "partition" };
  g_autoptr(GRand) rand = g_rand_new_with_seed (seed * 2654435761u + index);
  LaminaElement element = index % LAMINA_N_ELEMENTS;
  const char *project = projects[g_rand_int_range (rand, 0, G_N_ELEMENTS (projects))];
  g_autofree char *id = g_strdup_printf ("bench-%06u", index);
  g_autofree char *name = NULL;
  LaminaConstruction *c;

  switch (element)
    {
    case LAMINA_ELEMENT_WALL:
    default:
      name = g_strdup_printf ("%s external %s %u", project, kinds[element], index);
      break;
    case LAMINA_ELEMENT_ROOF:
    case LAMINA_ELEMENT_FLOOR:
    case LAMINA_ELEMENT_CEILING:
    case LAMINA_ELEMENT_PARTITION:
      name = g_strdup_printf ("%s %s %u", project, kinds[element], index);
      break;
    }
  c = lamina_construction_new (id, name, element);
  c->code = g_strdup_printf ("%s-%05u", codes[element], index);
  c->description = g_strdup_printf ("Build-up %u of the invented %s project", index, project);
  lamina_construction_add_tag (c, tags[g_rand_int_range (rand, 0, G_N_ELEMENTS (tags))]);
  if (g_rand_boolean (rand))
    lamina_construction_add_tag (c, tags[g_rand_int_range (rand, 0, G_N_ELEMENTS (tags))]);
  c->target_u = pick (rand, 0.15, 0.35, 0.05);
  switch (element)
    {
    case LAMINA_ELEMENT_WALL:
    default:
      build_wall (c, rand);
      break;
    case LAMINA_ELEMENT_ROOF:
      build_roof (c, rand);
      break;
    case LAMINA_ELEMENT_FLOOR:
      build_floor (c, rand);
      break;
    case LAMINA_ELEMENT_CEILING:
      build_ceiling (c, rand);
      break;
    case LAMINA_ELEMENT_PARTITION:
      c->outer_side = LAMINA_OUTER_SIDE_INDOOR;
      c->target_u = NAN;
      build_partition (c, rand);
      break;
    }
  return c;
}

LaminaConstruction *
lamina_bench_make_wall_12 (void)
{
  LaminaConstruction *c = lamina_construction_new ("bench-wall-12", "Bench wall of twelve layers",
                                                   LAMINA_ELEMENT_WALL);

  c->code = g_strdup ("EW-12");
  add (c, M_GYPSUM, 12.5);
  add (c, M_GYPSUM, 12.5);
  add_framed (c, M_MINERAL_WOOL, 45, 600, NULL);
  lamina_construction_add_layer (c, lamina_layer_new_resistance (0.2, 0));
  add (c, M_OSB, 12);
  add_framed (c, M_MINERAL_WOOL, 145, 600, "stud");
  add_framed (c, M_MINERAL_WOOL, 95, 600, "stud");
  add (c, M_GYPSUM, 9);
  add (c, M_WOOD_FIBRE, 60);
  lamina_construction_add_layer (c, lamina_layer_new_resistance (0.5, 0));
  lamina_construction_add_layer (c, lamina_layer_new_air (25, LAMINA_AIR_UNVENTILATED));
  add (c, M_LARCH, 22);
  return c;
}
