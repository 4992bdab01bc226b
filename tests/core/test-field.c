/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The 2-D conduction solver against EN ISO 10211:2017 Annex C (normative),
 * the validation of two-dimensional "high precision" methods, and against
 * the bounds and limits of EN ISO 6946:2017. */
#include "lamina-test-util.h"
#include "lamina-field.h"

/* EN ISO 10211:2017 Annex C, test reference case 1: half of a square
 * column of side L; the top edge held at 20 °C, the left and bottom edges
 * at 0 °C, the cut edge (x = L/2) adiabatic, no surface resistances.  The
 * 28 reference temperatures on a grid of L/8, rows from y = 7L/8 down to
 * L/8, columns x = L/8, L/4, 3L/8, L/2 (°C, as tabulated in the annex,
 * from memory).  A method must reproduce them within 0.1 K. */
static const double case1_reference[7][4] = {
  { 9.7, 13.4, 14.7, 15.1 },
  { 5.3, 8.6, 10.3, 10.8 },
  { 3.2, 5.6, 7.0, 7.5 },
  { 2.0, 3.6, 4.7, 5.0 },
  { 1.3, 2.3, 3.0, 3.2 },
  { 0.7, 1.4, 1.8, 1.9 },
  { 0.3, 0.6, 0.8, 0.9 },
};

/* The analytic solution the annex tabulates: separation of variables on
 * the full square (0 on three sides, 20 °C on top),
 *   T = (4·20/π) Σ_{n odd} sin(nπx/L) sinh(nπy/L) / (n sinh nπ). */
static double
case1_series (double x,
              double y)
{
  double sum = 0.0;

  for (int n = 1; n < 400; n += 2)
    {
      /* sinh(nπy)/sinh(nπ) without overflow: e^{nπ(y−1)}(1 − e^{−2nπy})/(1 − e^{−2nπ}) */
      double ratio = exp (n * G_PI * (y - 1.0)) * (1.0 - exp (-2.0 * n * G_PI * y))
                     / (1.0 - exp (-2.0 * n * G_PI));
      sum += sin (n * G_PI * x) * ratio / n;
    }
  return 4.0 * 20.0 / G_PI * sum;
}

static void
test_case1_series (void)
{
  /* The series itself against the annex's table (the table is the series
   * rounded to 0.1 K), and the centre of the square: 5 °C exactly by
   * superposition of the four rotations (common practice). */
  for (int row = 0; row < 7; row++)
    for (int col = 0; col < 4; col++)
      g_assert_cmpfloat_with_epsilon (case1_series ((col + 1) / 8.0, (7 - row) / 8.0),
                                      case1_reference[row][col], 0.05 + 1e-9);
  g_assert_cmpfloat_with_epsilon (case1_series (0.5, 0.5), 5.0, 1e-9);
}

static void
test_case1 (void)
{
  g_autoptr (LaminaFieldModel) model = lamina_field_model_new (0.5, 1.0);
  g_autoptr (LaminaFieldSolution) s = NULL;
  g_autoptr (GError) error = NULL;
  guint m = lamina_field_model_add_material (model, 1.0, 1.0);

  lamina_field_model_add_rectangle (model, 0, 0, 0.5, 1.0, m);
  lamina_field_model_set_boundary (model, LAMINA_FIELD_SIDE_TOP, 0.0, 20.0);
  lamina_field_model_set_boundary (model, LAMINA_FIELD_SIDE_LEFT, 0.0, 0.0);
  lamina_field_model_set_boundary (model, LAMINA_FIELD_SIDE_BOTTOM, 0.0, 0.0);
  for (int row = 0; row < 7; row++)
    for (int col = 0; col < 4; col++)
      lamina_field_model_add_point (model, (col + 1) / 8.0, (7 - row) / 8.0);

  /* The held edges meet at a step from 0 to 20 °C, where the heat flux is
   * singular: the boundary heat flow grows without end under refinement,
   * so this case is judged on temperatures at a fixed grid (two halvings
   * of the first, about 10⁴ cells). */
  s = lamina_field_model_solve_level (model, 2, NULL, NULL, NULL, &error);
  g_assert_no_error (error);
  g_test_message ("case 1: %u cells, %u iterations", lamina_field_solution_get_cells (s), s->iterations);
  for (int row = 0; row < 7; row++)
    for (int col = 0; col < 4; col++)
      {
        double x = (col + 1) / 8.0, y = (7 - row) / 8.0;
        double t = lamina_field_solution_temperature_at (s, x, y);

        /* Annex C: within 0.1 K of the table; and, tighter, of the series. */
        g_assert_cmpfloat_with_epsilon (t, case1_reference[row][col], 0.1);
        g_assert_cmpfloat_with_epsilon (t, case1_series (x, y), 0.02);
      }
}

/* EN ISO 10211:2017 Annex C, test reference case 2 (dimensions and values
 * from memory): a section 500 mm wide; a concrete slab λ 1.15, 6 mm, on
 * top, its upper face (AB) at 0 °C through Rs 0.06; under the slab at the
 * left edge a wood batten λ 0.12, 15 × 5 mm; insulation λ 0.029 filling
 * 40 mm between the slab and the aluminium profile (λ 230, 1.5 mm thick):
 * a bottom plate across the width, a web at the left edge up through the
 * insulation and a 15 mm flange under the batten; the lower face (HI) at
 * 20 °C through Rs 0.11; both sides adiabatic.  Reference: 9.5 W/m and
 * nine temperatures, each within 0.1 W/m and 0.1 K. */
static void
test_case2 (void)
{
  const double w = 0.5, plate = 0.0015, ins = 0.040, slab = 0.006;
  const double h = plate + ins + slab;          /* 47.5 mm */
  const double under = plate + ins;             /* slab underside, 41.5 mm */
  const double batten = under - 0.005;          /* batten underside */
  g_autoptr (LaminaFieldModel) model = lamina_field_model_new (w, h);
  g_autoptr (LaminaFieldSolution) s = NULL;
  g_autoptr (GError) error = NULL;
  LaminaFieldRefinement ref;
  guint concrete = lamina_field_model_add_material (model, 1.15, 1.15);
  guint wood = lamina_field_model_add_material (model, 0.12, 0.12);
  guint insulation = lamina_field_model_add_material (model, 0.029, 0.029);
  guint aluminium = lamina_field_model_add_material (model, 230, 230);
  struct { const char *name; double x, y, t; } points[] = {
    { "A", 0, h, 7.1 }, { "B", w, h, 0.8 },
    { "C", 0, under, 7.9 }, { "D", 0.015, under, 6.3 }, { "E", w, under, 0.8 },
    { "F", 0, batten, 16.4 }, { "G", 0.015, batten, 16.3 },
    { "H", 0, 0, 16.8 }, { "I", w, 0, 18.3 },
  };

  lamina_field_model_add_rectangle (model, 0, under, w, h, concrete);
  lamina_field_model_add_rectangle (model, 0, plate, w, under, insulation);
  lamina_field_model_add_rectangle (model, 0, batten, 0.015, under, wood);
  lamina_field_model_add_rectangle (model, 0, 0, w, plate, aluminium);
  lamina_field_model_add_rectangle (model, 0, plate, plate, batten, aluminium);
  lamina_field_model_add_rectangle (model, 0, batten - plate, 0.015, batten, aluminium);
  lamina_field_model_set_boundary (model, LAMINA_FIELD_SIDE_TOP, 0.06, 0.0);
  lamina_field_model_set_boundary (model, LAMINA_FIELD_SIDE_BOTTOM, 0.11, 20.0);
  lamina_field_model_set_spacing (model, 0.005, 0.0005);

  s = lamina_field_model_solve (model, 0, &ref, NULL, NULL, &error);
  g_assert_no_error (error);
  g_assert_true (ref.converged);
  g_test_message ("case 2: %.3f W/m in, %.3f W/m out, %u cells",
                  s->heat_flow[LAMINA_FIELD_SIDE_BOTTOM], s->heat_flow[LAMINA_FIELD_SIDE_TOP],
                  lamina_field_solution_get_cells (s));
  g_assert_cmpfloat_with_epsilon (s->heat_flow[LAMINA_FIELD_SIDE_BOTTOM], 9.5, 0.1);
  /* Energy balance: what enters leaves (solver tolerance 1e-10). */
  g_assert_cmpfloat_with_epsilon (s->heat_flow[LAMINA_FIELD_SIDE_BOTTOM],
                                  -s->heat_flow[LAMINA_FIELD_SIDE_TOP], 1e-6);
  for (guint k = 0; k < G_N_ELEMENTS (points); k++)
    {
      double t = lamina_field_solution_temperature_at (s, points[k].x, points[k].y);
      g_test_message ("%s: %.2f °C (reference %.1f)", points[k].name, t, points[k].t);
      g_assert_cmpfloat_with_epsilon (t, points[k].t, 0.1);
    }
}

static LaminaFieldResult *
field_ok (const LaminaConstruction *c)
{
  g_autoptr (GError) error = NULL;
  LaminaFieldResult *r = lamina_field_calculate (c, 0, NULL, NULL, &error);

  g_assert_no_error (error);
  g_assert_nonnull (r);
  return r;
}

static LaminaResult *
calc_ok (const LaminaConstruction *c)
{
  g_autoptr (GError) error = NULL;
  LaminaResult *r = lamina_calculate (c, &error);

  g_assert_no_error (error);
  return r;
}

/* A homogeneous build-up is one-dimensional: the 2-D U equals EN ISO 6946
 * 6.7.1 exactly (to solver tolerance), and so do the surface temperature
 * and fRsi.  Masonry wall, Rsi 0.13, Rse 0.04 (Table 7):
 *   RT = 0.13 + 0.015/0.57 + 0.215/0.77 + 0.1/0.035 + 0.0125/0.25 + 0.04 */
static void
test_homogeneous (void)
{
  g_autoptr (LaminaConstruction) c = test_wall ();
  g_autoptr (LaminaFieldResult) f = NULL;
  g_autoptr (LaminaResult) r = NULL;
  double rt = 0.13 + 0.015 / 0.57 + 0.215 / 0.77 + 0.1 / 0.035 + 0.0125 / 0.25 + 0.04;

  lamina_construction_add_layer (c, test_layer (15, "plaster", LAMINA_CATEGORY_PLASTER, 0.57));
  lamina_construction_add_layer (c, test_layer (215, "brick", LAMINA_CATEGORY_MASONRY, 0.77));
  lamina_construction_add_layer (c, test_layer (100, "eps", LAMINA_CATEGORY_INSULATION, 0.035));
  lamina_construction_add_layer (c, test_layer (12.5, "render-board", LAMINA_CATEGORY_BOARD, 0.25));
  f = field_ok (c);
  r = calc_ok (c);
  assert_close (r->u, 1.0 / rt, 1e-12);
  assert_close (f->u, 1.0 / rt, 1e-8);
  assert_close (f->u_6946, r->u_corrected, 1e-12);
  /* θsi = θi − Rsi·U·Δθ, fRsi = 1 − Rsi·U */
  assert_close (f->f_rsi, 1.0 - 0.13 / rt, 1e-8);
  assert_close (f->f_rsi_mould, 1.0 - 0.25 / (rt - 0.13 + 0.25), 1e-8);
  assert_close (f->min_inner_surface_temperature, r->surface_temperature_inner, 1e-7);
  assert_close (f->heat_flow, f->u * f->module_width / 1000.0 * 30.0, 1e-9);
}

static LaminaConstruction *
stud_wall (double          stud_conductivity,
           LaminaCategory  stud_category,
           double          stud_width)
{
  LaminaConstruction *c = test_wall ();
  LaminaLayer *framed = lamina_layer_new_bridged (140);

  lamina_layer_add_part (framed, lamina_part_new (test_material ("mw", LAMINA_CATEGORY_INSULATION, 0.035), NAN));
  lamina_layer_add_part (framed, lamina_part_new_framing (test_material ("stud", stud_category, stud_conductivity),
                                                          stud_width, 600, "stud"));
  lamina_construction_add_layer (c, test_layer (12.5, "plasterboard", LAMINA_CATEGORY_BOARD, 0.25));
  lamina_construction_add_layer (c, framed);
  lamina_construction_add_layer (c, test_layer (12, "osb", LAMINA_CATEGORY_BOARD, 0.13));
  lamina_construction_add_layer (c, test_layer (50, "wood-fibre", LAMINA_CATEGORY_INSULATION, 0.040));
  return c;
}

/* EN ISO 6946:2017 6.7.2: R'T (parallel, adiabatic between the paths) is
 * an upper and R''T (isothermal planes) a lower bound of the true
 * resistance, so the exact U lies between 1/R'T and 1/R''T.  A timber stud
 * wall (45 mm softwood λ 0.13 at 600 mm in mineral wool λ 0.035). */
static void
test_timber_between_limits (void)
{
  g_autoptr (LaminaConstruction) c = stud_wall (0.13, LAMINA_CATEGORY_TIMBER, 45);
  g_autoptr (LaminaFieldResult) f = field_ok (c);
  g_autoptr (LaminaResult) r = calc_ok (c);

  g_test_message ("timber: 1/R'T %.5f, 2-D %.5f, 1/R''T %.5f, 6946 %.5f, %u cells",
                  1 / r->r_upper, f->u, 1 / r->r_lower, r->u, f->cells);
  g_assert_cmpfloat (f->u, >, 1.0 / r->r_upper);
  g_assert_cmpfloat (f->u, <, 1.0 / r->r_lower);
  /* Timber bridging is mild: 6946's mean is within its own error bound e. */
  g_assert_cmpfloat (fabs (f->u - r->u) / r->u, <, r->relative_error);
  g_assert_cmpfloat (f->module_width, ==, 600.0);
  /* The coldest inner point is over the stud, at the module centre. */
  g_assert_cmpfloat_with_epsilon (f->min_inner_surface_position, 300.0, 1e-9);
}

/* The same bounds hold where the simple method does not apply: a steel
 * stud (1.2 mm web, λ 50) bridging the mineral wool, where R'T/R''T is
 * about 2.1 and 6946's mean is only a guess between the bounds.  The
 * coldest point is on the stud line, and the mould criterion's larger Rsi
 * gives the lower fRsi. */
static void
test_steel_stud (void)
{
  g_autoptr (LaminaConstruction) c = stud_wall (50, LAMINA_CATEGORY_METAL, 1.2);
  g_autoptr (LaminaFieldResult) f = field_ok (c);
  g_autoptr (LaminaResult) r = calc_ok (c);

  g_test_message ("steel: 1/R'T %.5f, 2-D %.5f, 1/R''T %.5f, 6946 %.5f, %u cells, levels %u",
                  1 / r->r_upper, f->u, 1 / r->r_lower, r->u, f->cells, f->refinement.n_levels);
  g_assert_true (lamina_field_is_advised (r));
  g_assert_cmpfloat (f->u, >, 1.0 / r->r_upper);
  g_assert_cmpfloat (f->u, <, 1.0 / r->r_lower);
  g_assert_true (f->refinement.converged);
  g_assert_cmpfloat_with_epsilon (f->min_inner_surface_position, 300.0, 1e-9);
  g_assert_cmpfloat (f->f_rsi_mould, <, f->f_rsi);
}

/* A module with its member centred is symmetric about the centre line
 * (adiabatic edges are lines of symmetry, EN ISO 10211 5.2.2). */
static void
test_symmetry (void)
{
  g_autoptr (LaminaConstruction) c = stud_wall (50, LAMINA_CATEGORY_METAL, 1.2);
  g_autoptr (GError) error = NULL;
  /* A grid of at most 20,000 nodes is enough to show the symmetry. */
  g_autoptr (LaminaFieldResult) f = lamina_field_calculate (c, 20000, NULL, NULL, &error);
  const LaminaFieldSolution *s = f->field;
  double worst = 0.0;

  g_assert_no_error (error);
  for (guint j = 0; j < s->ny; j++)
    for (guint i = 0; i < s->nx; i++)
      {
        double x = s->x[i], mirror = s->x[s->nx - 1] - x;
        double a = s->t[j * s->nx + i];
        double b = lamina_field_solution_temperature_at (s, mirror, s->y[j]);
        worst = MAX (worst, fabs (a - b));
      }
  g_assert_cmpfloat (worst, <, 1e-6);
}

/* The refinement halves the grid until U changes less than 0.1 %, and the
 * change shrinks as the grid gets finer (second-order scheme: about ×4
 * per halving once the grid resolves the field). */
static void
test_grid_convergence (void)
{
  g_autoptr (LaminaConstruction) c = stud_wall (0.13, LAMINA_CATEGORY_TIMBER, 45);
  g_autoptr (LaminaFieldResult) f = field_ok (c);
  const LaminaFieldRefinement *ref = &f->refinement;
  double change_first, change_last;

  g_assert_true (ref->converged);
  g_assert_cmpuint (ref->n_levels, >=, 2);
  g_assert_cmpfloat (ref->change, <, LAMINA_FIELD_CONVERGENCE);
  for (guint k = 1; k < ref->n_levels; k++)
    g_assert_cmpuint (ref->cells[k], >, 3 * ref->cells[k - 1]);
  if (ref->n_levels >= 3)
    {
      change_first = fabs (ref->throughput[1] - ref->throughput[0]);
      change_last = fabs (ref->throughput[ref->n_levels - 1] - ref->throughput[ref->n_levels - 2]);
      g_assert_cmpfloat (change_last, <, change_first);
    }
  /* A finer grid than the rule asks for changes U by less than 0.1 %. */
  {
    g_autoptr (GError) error = NULL;
    g_autoptr (LaminaFieldResult) fine = NULL;
    fine = lamina_field_calculate (c, 0, NULL, NULL, &error);
    g_assert_no_error (error);
    assert_close (fine->u, f->u, 1e-12);
  }
}

/* Battens across the studs cross the section and enter with their
 * lower-limit equivalent conductivity; the result says so. */
static void
test_crossing_pattern (void)
{
  g_autoptr (LaminaConstruction) c = stud_wall (0.13, LAMINA_CATEGORY_TIMBER, 45);
  LaminaLayer *battens = lamina_layer_new_bridged (45);
  g_autoptr (LaminaFieldResult) f = NULL;
  g_autoptr (LaminaResult) r = NULL;
  gboolean noted = FALSE;

  lamina_layer_add_part (battens, lamina_part_new (test_material ("mw", LAMINA_CATEGORY_INSULATION, 0.035), NAN));
  lamina_layer_add_part (battens, lamina_part_new_framing (test_material ("softwood", LAMINA_CATEGORY_TIMBER, 0.13),
                                                           45, 400, "batten"));
  g_ptr_array_insert (c->layers, 1, battens);
  f = field_ok (c);
  r = calc_ok (c);
  for (guint k = 0; k < f->notes->len; k++)
    noted |= strstr (f->notes->pdata[k], "Layer 2 crosses the section") != NULL;
  g_assert_true (noted);
  g_assert_cmpfloat (f->module_width, ==, 600.0);
  g_assert_cmpfloat (f->u, >, 1.0 / r->r_upper);
  g_assert_cmpfloat (f->u, <, 1.0 / r->r_lower);
}

static gboolean
cancel_at_once (double   fraction,
                gpointer user_data)
{
  (void) fraction;
  (void) user_data;
  return FALSE;
}

static void
test_cancel (void)
{
  g_autoptr (LaminaConstruction) c = stud_wall (50, LAMINA_CATEGORY_METAL, 1.2);
  g_autoptr (GError) error = NULL;
  g_autoptr (LaminaFieldResult) f = lamina_field_calculate (c, 0, cancel_at_once, NULL, &error);

  g_assert_null (f);
  g_assert_error (error, LAMINA_FIELD_ERROR, LAMINA_FIELD_ERROR_CANCELLED);
}

int
main (int argc, char *argv[])
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/field/iso10211-case1-series", test_case1_series);
  g_test_add_func ("/core/field/iso10211-case1", test_case1);
  g_test_add_func ("/core/field/iso10211-case2", test_case2);
  g_test_add_func ("/core/field/homogeneous-is-1d", test_homogeneous);
  g_test_add_func ("/core/field/timber-between-limits", test_timber_between_limits);
  g_test_add_func ("/core/field/steel-stud", test_steel_stud);
  g_test_add_func ("/core/field/symmetry", test_symmetry);
  g_test_add_func ("/core/field/grid-convergence", test_grid_convergence);
  g_test_add_func ("/core/field/crossing-pattern", test_crossing_pattern);
  g_test_add_func ("/core/field/cancel", test_cancel);
  return g_test_run ();
}
