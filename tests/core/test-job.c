/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Jobs: the schedule checked against a target set per use, U·A, the
 * area-weighted mean U per element kind and H_T = Σ U·A (EN ISO 13789:2017
 * 8.2, transmission heat transfer through the listed elements: H_D = Σ A·U
 * + Σ l·ψ; from memory), moving an entry to another revision, and the
 * refusals of bad job data.  The U values are worked by hand from
 * EN ISO 6946:2017 6.7.1 and Table 7 beside each build-up; the targets are
 * invented for the test, no regulation's values. */
#include "lamina-test-util.h"

#include "lamina-error.h"
#include "lamina-job-check.h"

/* plasterboard 12.5 mm λ 0.25, mineral wool λ 0.035, concrete 200 mm λ 1.35
 * (EN ISO 10456:2007 Table 3, from memory; wool a typical declared value). */
static LaminaConstruction *
wall (const char *id,
      double      insulation)
{
  LaminaConstruction *c = lamina_construction_new (id, id, LAMINA_ELEMENT_WALL);

  lamina_construction_add_layer (c, test_layer (12.5, "plasterboard", LAMINA_CATEGORY_BOARD, 0.25));
  lamina_construction_add_layer (c, test_layer (insulation, "mineral-wool", LAMINA_CATEGORY_INSULATION, 0.035));
  lamina_construction_add_layer (c, test_layer (200, "concrete", LAMINA_CATEGORY_CONCRETE, 1.35));
  c->status = LAMINA_STATUS_APPROVED;
  return c;
}

static LaminaConstruction *
slab (const char    *id,
      LaminaElement  element)
{
  LaminaConstruction *c = lamina_construction_new (id, id, element);

  if (element == LAMINA_ELEMENT_ROOF)
    {
      lamina_construction_add_layer (c, test_layer (200, "concrete", LAMINA_CATEGORY_CONCRETE, 1.35));
      lamina_construction_add_layer (c, test_layer (200, "mineral-wool", LAMINA_CATEGORY_INSULATION, 0.035));
    }
  else
    {
      lamina_construction_add_layer (c, test_layer (200, "concrete", LAMINA_CATEGORY_CONCRETE, 1.35));
      lamina_construction_add_layer (c, test_layer (100, "mineral-wool", LAMINA_CATEGORY_INSULATION, 0.035));
    }
  c->status = LAMINA_STATUS_APPROVED;
  return c;
}

static LaminaTargetSet *
invented_targets (void)
{
  LaminaTargetSet *set = lamina_target_set_new ("test-set", "Invented test table");
  LaminaTarget *t;

  t = lamina_target_new ("external-wall", 0.20);
  t->element = LAMINA_ELEMENT_WALL;
  lamina_target_set_add (set, t);
  lamina_target_set_add (set, lamina_target_new ("roof", 0.18));
  lamina_target_set_add (set, lamina_target_new ("floor-outside-air", 0.25));
  t = lamina_target_new ("floor-ground", 0.35);
  t->ground = TRUE;
  lamina_target_set_add (set, t);
  return set;
}

typedef struct
{
  LaminaJob          *job;
  LaminaTargetSet    *targets;
  LaminaConstruction *c[5];
  LaminaResult       *r[5];
  LaminaJobInput      in[5];
} Fixture;

static void
add (Fixture            *f,
     guint               i,
     LaminaConstruction *c,
     const char         *use,
     double              area)
{
  g_autoptr(GError) error = NULL;
  LaminaJobEntry *e = lamina_job_add_entry (f->job, lamina_job_entry_new (c->id, 1, use));

  e->area = area;
  f->c[i] = c;
  f->r[i] = lamina_calculate (c, &error);
  g_assert_no_error (error);
  f->in[i].construction = c;
  f->in[i].result = f->r[i];
}

static void
fixture_init (Fixture *f)
{
  memset (f, 0, sizeof *f);
  f->job = lamina_job_new ("j1", "Test house");
  f->targets = invented_targets ();
  add (f, 0, wall ("wall-150", 150), "external-wall", 100);
  add (f, 1, wall ("wall-200", 200), "external-wall", 50);
  add (f, 2, slab ("roof-200", LAMINA_ELEMENT_ROOF), "roof", 80);
  add (f, 3, slab ("floor-100", LAMINA_ELEMENT_FLOOR), "floor-outside-air", 60);
  add (f, 4, slab ("floor-100b", LAMINA_ELEMENT_FLOOR), "floor-ground", NAN);
}

static void
fixture_clear (Fixture *f)
{
  lamina_job_free (f->job);
  lamina_target_set_free (f->targets);
  for (guint i = 0; i < G_N_ELEMENTS (f->c); i++)
    {
      lamina_construction_free (f->c[i]);
      lamina_result_free (f->r[i]);
    }
}

/* Compliance per use: U ≤ the use's maximum (the corrected U, 6946 Annex F).
 * wall-150: RT = 0.13 + 0.05 + 4.285714 + 0.148148 + 0.04 = 4.653862,
 *           U = 0.214875 > 0.20 → not met.
 * wall-200: RT = 6.082434, U = 0.164408 ≤ 0.20 → met.
 * roof (upward, Rsi 0.10): RT = 0.10 + 0.148148 + 5.714286 + 0.04 =
 *           6.002434, U = 0.166599 ≤ 0.18 → met.
 * floor over outside air (downward, Rsi 0.17): RT = 0.17 + 0.148148 +
 *           2.857143 + 0.04 = 3.215291, U = 0.311014 > 0.25 → not met. */
static void
test_compliance_per_use (void)
{
  Fixture f;
  g_autoptr(LaminaJobCheck) check = NULL;
  const LaminaJobLine *l;

  fixture_init (&f);
  check = lamina_job_check (f.job, f.targets, f.in, 5);
  l = g_ptr_array_index (check->lines, 0);
  assert_close (l->u, 0.214875, 1e-5);
  g_assert_cmpfloat (l->max_u, ==, 0.20);
  g_assert_cmpint (l->verdict, ==, LAMINA_VERDICT_NOT_MET);
  g_assert_cmpuint (l->notes->len, ==, 1);
  l = g_ptr_array_index (check->lines, 1);
  assert_close (l->u, 0.164408, 1e-5);
  g_assert_cmpint (l->verdict, ==, LAMINA_VERDICT_MET);
  g_assert_cmpint (l->flags, ==, LAMINA_ENTRY_NONE);
  l = g_ptr_array_index (check->lines, 2);
  assert_close (l->u, 0.166599, 1e-5);
  g_assert_cmpint (l->verdict, ==, LAMINA_VERDICT_MET);
  l = g_ptr_array_index (check->lines, 3);
  assert_close (l->u, 0.311014, 1e-5);
  g_assert_cmpint (l->verdict, ==, LAMINA_VERDICT_NOT_MET);
  /* A ground-floor target is for the floor with the ground (EN ISO
   * 13370:2017 clause 1); U 0.311014 ≤ 0.35 is met, but an EN ISO 6946 U is
   * flagged as out of that scope, whatever it is. */
  l = g_ptr_array_index (check->lines, 4);
  g_assert_cmpint (l->verdict, ==, LAMINA_VERDICT_MET);
  g_assert_true (l->flags & LAMINA_ENTRY_OUT_OF_SCOPE);
  g_assert_cmpuint (check->n_met, ==, 3);
  g_assert_cmpuint (check->n_not_met, ==, 2);
  fixture_clear (&f);
}

/* U·A and H_T against a hand sum (EN ISO 13789:2017 8.2, H = Σ A·U + Σ l·ψ,
 * from memory), the fabric of the listed elements only:
 *   0.214875 × 100 = 21.487528
 *   0.164408 ×  50 =  8.220394
 *   0.166599 ×  80 = 13.327927
 *   0.311014 ×  60 = 18.660830
 *   Σ U·A          = 61.696679 W/K (the ground floor has no area: left out)
 * mean U of the walls = (21.487528 + 8.220394) / 150 = 0.198053.
 * Two junctions ψ 0.05 × 40 m + ψ 0.10 × 12 m = 2.0 + 1.2 = 3.2 W/K are
 * summed beside it: 64.896679 W/K in all. */
static void
test_heat_loss_hand_sum (void)
{
  Fixture f;
  g_autoptr(LaminaJobCheck) check = NULL;

  fixture_init (&f);
  lamina_job_add_junction (f.job, lamina_job_junction_new ("wall–roof eaves", 0.05, 40));
  lamina_job_add_junction (f.job, lamina_job_junction_new ("wall–floor", 0.10, 12));
  check = lamina_job_check (f.job, f.targets, f.in, 5);
  assert_close (((LaminaJobLine *) g_ptr_array_index (check->lines, 0))->ua, 21.487528, 1e-6);
  g_assert_true (isnan (((LaminaJobLine *) g_ptr_array_index (check->lines, 4))->ua));
  assert_close (check->h_t, 61.696679, 1e-6);
  assert_close (check->area, 290.0, 1e-12);
  assert_close (check->kinds[LAMINA_ELEMENT_WALL].mean_u, 0.198053, 1e-5);
  assert_close (check->kinds[LAMINA_ELEMENT_WALL].area, 150.0, 1e-12);
  assert_close (check->kinds[LAMINA_ELEMENT_ROOF].mean_u, 0.166599, 1e-5);
  g_assert_true (isnan (check->kinds[LAMINA_ELEMENT_CEILING].mean_u));
  assert_close (check->h_junctions, 3.2, 1e-12);
  assert_close (check->h_total, 64.896679, 1e-6);
  fixture_clear (&f);
}

/* The temperature factor of a plane element, fRsi = (θsi − θe)/(θi − θe)
 * = 1 − Rsi·U with Rsi = 0.25 (EN ISO 13788:2012 4.2, from memory):
 * wall-150, 1 − 0.25 × 0.214875 = 0.946281: a minimum of 0.95 fails, 0.94
 * is met.  A construction of another element kind than the use names and a
 * revision not approved are flagged; a use without a target is open. */
static void
test_frsi_and_flags (void)
{
  Fixture f;
  g_autoptr(LaminaJobCheck) check = NULL;
  LaminaTarget *wall_target;
  const LaminaJobLine *l;

  fixture_init (&f);
  wall_target = g_ptr_array_index (f.targets->targets, 0);
  wall_target->max_u = 0.25;
  wall_target->min_frsi = 0.95;
  f.c[1]->status = LAMINA_STATUS_CHECKED;
  g_free (((LaminaJobEntry *) g_ptr_array_index (f.job->entries, 2))->use);
  ((LaminaJobEntry *) g_ptr_array_index (f.job->entries, 2))->use = g_strdup ("external-wall");
  g_free (((LaminaJobEntry *) g_ptr_array_index (f.job->entries, 3))->use);
  ((LaminaJobEntry *) g_ptr_array_index (f.job->entries, 3))->use = g_strdup ("balcony");
  check = lamina_job_check (f.job, f.targets, f.in, 5);
  l = g_ptr_array_index (check->lines, 0);
  assert_close (l->frsi, 0.946281, 1e-5);
  g_assert_cmpint (l->verdict, ==, LAMINA_VERDICT_NOT_MET);
  g_assert_true (l->flags & LAMINA_ENTRY_FRSI_NOT_MET);
  l = g_ptr_array_index (check->lines, 1);
  g_assert_cmpint (l->verdict, ==, LAMINA_VERDICT_MET);
  g_assert_true (l->flags & LAMINA_ENTRY_NOT_APPROVED);
  l = g_ptr_array_index (check->lines, 2);
  g_assert_true (l->flags & LAMINA_ENTRY_WRONG_ELEMENT);
  l = g_ptr_array_index (check->lines, 3);
  g_assert_cmpint (l->verdict, ==, LAMINA_VERDICT_NO_TARGET);
  g_assert_true (isnan (l->max_u));
  g_clear_pointer (&check, lamina_job_check_free);
  wall_target->min_frsi = 0.94;
  check = lamina_job_check (f.job, f.targets, f.in, 5);
  g_assert_cmpint (((LaminaJobLine *) g_ptr_array_index (check->lines, 0))->verdict, ==,
                   LAMINA_VERDICT_MET);
  /* No target set at all: nothing is met, nothing fails. */
  g_clear_pointer (&check, lamina_job_check_free);
  check = lamina_job_check (f.job, NULL, f.in, 5);
  g_assert_cmpuint (check->n_met + check->n_not_met, ==, 0);
  g_assert_cmpuint (check->n_open, ==, 5);
  fixture_clear (&f);
}

/* A missing construction is not calculated and counts nowhere; a newer
 * approved revision is flagged with its number; moving the entry is
 * recorded in the log. */
static void
test_pins_and_moves (void)
{
  Fixture f;
  g_autoptr(LaminaJobCheck) check = NULL;
  const LaminaJobLine *l;
  const LaminaJobEvent *event;

  fixture_init (&f);
  f.in[0].construction = NULL;
  f.in[0].flags = LAMINA_ENTRY_MISSING;
  f.in[1].flags = LAMINA_ENTRY_NEWER_APPROVED;
  f.in[1].newer_revision = 3;
  check = lamina_job_check (f.job, f.targets, f.in, 5);
  l = g_ptr_array_index (check->lines, 0);
  g_assert_cmpint (l->verdict, ==, LAMINA_VERDICT_NOT_CALCULATED);
  assert_close (check->kinds[LAMINA_ELEMENT_WALL].area, 50.0, 1e-12);
  l = g_ptr_array_index (check->lines, 1);
  g_assert_cmpint (l->newer_revision, ==, 3);
  g_assert_nonnull (strstr (g_ptr_array_index (l->notes, 0), "3"));

  g_assert_true (lamina_job_move_entry (f.job, 2, 3, "2026-01-02T10:00:00Z", "A. Architect"));
  g_assert_cmpint (lamina_job_find_entry (f.job, 2)->revision, ==, 3);
  g_assert_cmpuint (f.job->log->len, ==, 1);
  event = g_ptr_array_index (f.job->log, 0);
  g_assert_cmpstr (event->by, ==, "A. Architect");
  g_assert_nonnull (strstr (event->text, "revision 1 to revision 3"));
  g_assert_false (lamina_job_move_entry (f.job, 99, 3, NULL, NULL));
  /* Numbers stay with their entries when one is removed. */
  g_assert_true (lamina_job_remove_entry (f.job, 1));
  g_assert_cmpint (lamina_job_add_entry (f.job, lamina_job_entry_new ("x", 1, "roof"))->n, ==, 6);
  fixture_clear (&f);
}

/* B′ = A / (0.5 P), EN ISO 13370:2017 8.1 (from memory):
 * 100 m² over 40 m of exposed perimeter gives 100 / 20 = 5 m. */
static void
test_b_prime (void)
{
  g_autoptr(LaminaJob) job = lamina_job_new ("j", "J");

  g_assert_true (isnan (lamina_job_get_b_prime (job)));
  job->ground_area = 100;
  job->ground_perimeter = 40;
  assert_close (lamina_job_get_b_prime (job), 5.0, 1e-12);
  job->ground_b_prime = 4.2;
  assert_close (lamina_job_get_b_prime (job), 4.2, 1e-12);
}

/* A floor that states its ground is checked by its U with the ground, in
 * the job's plan.  150 mm concrete (λ 1.35) and 100 mm EPS (λ 0.035) on
 * the ground, walls 300 mm, soil unknown (λ 2.0), EN ISO 13370:2017 9.1:
 * dt = w + λ (Rsi + Rf + Rse) = 0.3 + 2.0 × (0.17 + 0.111111 + 2.857143
 * + 0.04) = 6.656508 m.  The library's plan, A 100 m², P 40 m: B′ = 5 m
 * ≤ dt, U = λ / (0.457 B′ + dt) = 2 / (2.285 + 6.656508) = 0.223676.  The
 * job's plan, A 200 m², P 40 m: B′ = 10 m > dt, U = 2λ / (π B′ + dt)
 * × ln (π B′ / dt + 1) = 4 / 38.072435 × ln 5.719568 = 0.183219. */
static void
test_ground_floor (void)
{
  g_autoptr(LaminaJob) job = lamina_job_new ("j", "J");
  g_autoptr(LaminaTargetSet) set = invented_targets ();
  g_autoptr(LaminaConstruction) c = lamina_construction_new ("g", "slab", LAMINA_ELEMENT_FLOOR);
  g_autoptr(LaminaResult) own = NULL;
  g_autoptr(LaminaResult) in_job = NULL;
  g_autoptr(LaminaJobCheck) check = NULL;
  LaminaJobInput input = { 0 };
  const LaminaJobLine *line;

  lamina_construction_add_layer (c, test_layer (150, "concrete", LAMINA_CATEGORY_CONCRETE, 1.35));
  lamina_construction_add_layer (c, test_layer (100, "eps", LAMINA_CATEGORY_INSULATION, 0.035));
  c->has_ground = TRUE;
  c->ground.area = 100;
  c->ground.perimeter = 40;
  c->ground.wall_thickness = 300;
  c->status = LAMINA_STATUS_APPROVED;
  own = lamina_calculate (c, NULL);
  assert_close (lamina_job_result_u (own), 0.223676, 1e-5);

  job->ground_area = 200;
  job->ground_perimeter = 40;
  job->outside_temperature = -12;
  lamina_job_apply_conditions (job, c);
  g_assert_cmpfloat (c->outside_temperature, ==, -12);
  in_job = lamina_calculate (c, NULL);
  assert_close (in_job->ground.b_prime, 10.0, 1e-12);
  lamina_job_add_entry (job, lamina_job_entry_new ("g", 1, "floor-ground"))->area = 200;
  input.construction = c;
  input.result = in_job;
  check = lamina_job_check (job, set, &input, 1);
  line = check->lines->pdata[0];
  assert_close (line->u, 0.183219, 1e-5);
  g_assert_cmpint (line->verdict, ==, LAMINA_VERDICT_MET);
  g_assert_false (line->flags & LAMINA_ENTRY_OUT_OF_SCOPE);
  assert_close (check->h_t, 200 * 0.183219, 1e-5);

  /* B′ given alone: the same U. */
  job->ground_area = job->ground_perimeter = NAN;
  job->ground_b_prime = 10;
  lamina_job_apply_conditions (job, c);
  g_clear_pointer (&in_job, lamina_result_free);
  in_job = lamina_calculate (c, NULL);
  assert_close (lamina_job_result_u (in_job), 0.183219, 1e-5);
}

/* The job's design conditions: the inside temperature always; the
 * outside one for a construction to the outdoor air, not for one whose
 * outer side faces an adjacent indoor space, which keeps the temperature
 * stated for that space (common practice: the outdoor design temperature
 * is not the plant room's). */
static void
test_conditions (void)
{
  g_autoptr(LaminaJob) job = lamina_job_new ("j", "Conditions");
  g_autoptr(LaminaConstruction) outer = lamina_construction_new ("o", "external wall", LAMINA_ELEMENT_WALL);
  g_autoptr(LaminaConstruction) inner = lamina_construction_new ("i", "wall to the plant room", LAMINA_ELEMENT_WALL);

  job->inside_temperature = 21;
  job->outside_temperature = -12;
  outer->outside_temperature = inner->outside_temperature = 5;
  inner->outer_side = LAMINA_OUTER_SIDE_INDOOR;
  lamina_job_apply_conditions (job, outer);
  lamina_job_apply_conditions (job, inner);
  g_assert_cmpfloat (outer->inside_temperature, ==, 21);
  g_assert_cmpfloat (outer->outside_temperature, ==, -12);
  g_assert_cmpfloat (inner->inside_temperature, ==, 21);
  g_assert_cmpfloat (inner->outside_temperature, ==, 5);
}

static void
test_copy_equal (void)
{
  Fixture f;
  g_autoptr(LaminaJob) copy = NULL;
  g_autoptr(LaminaTargetSet) targets = NULL;

  fixture_init (&f);
  lamina_job_add_junction (f.job, lamina_job_junction_new ("eaves", 0.05, 40));
  copy = lamina_job_copy (f.job);
  g_assert_true (lamina_job_equal (copy, f.job));
  lamina_job_find_entry (copy, 3)->area = 81;
  g_assert_false (lamina_job_equal (copy, f.job));
  targets = lamina_target_set_copy (f.targets);
  g_assert_true (lamina_target_set_equal (targets, f.targets));
  ((LaminaTarget *) g_ptr_array_index (targets->targets, 3))->ground = FALSE;
  g_assert_false (lamina_target_set_equal (targets, f.targets));
  fixture_clear (&f);
}

/* Refusals name the field (table-driven, common practice). */
static void
test_refusals (void)
{
  static const struct { const char *what; const char *expect; } cases[] = {
    { "no-name", "name is missing" },
    { "area", "area=-1" },
    { "revision", "revision=0" },
    { "use", "use must be an identifier" },
    { "psi", "ψ=11" },
    { "temperature", "design temperatures" },
    { "variant", "origin" },
    { "ground", "ground-perimeter=0" },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autoptr(LaminaJob) job = lamina_job_new ("j", "J");
      LaminaJobEntry *e = lamina_job_add_entry (job, lamina_job_entry_new ("c", 1, "roof"));
      g_autoptr(GError) error = NULL;
      const char *w = cases[i].what;

      g_assert_true (lamina_job_validate (job, NULL, NULL));
      if (g_str_equal (w, "no-name"))
        g_clear_pointer (&job->name, g_free);
      else if (g_str_equal (w, "area"))
        e->area = -1;
      else if (g_str_equal (w, "revision"))
        e->revision = 0;
      else if (g_str_equal (w, "use"))
        {
          g_free (e->use);
          e->use = g_strdup ("external wall");
        }
      else if (g_str_equal (w, "psi"))
        lamina_job_add_junction (job, lamina_job_junction_new ("x", 11, 1));
      else if (g_str_equal (w, "temperature"))
        job->outside_temperature = -100;
      else if (g_str_equal (w, "variant"))
        e->origin = g_strdup ("c0");
      else
        job->ground_perimeter = 0;
      g_assert_false (lamina_job_validate (job, NULL, &error));
      g_assert_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID);
      if (strstr (error->message, cases[i].expect) == NULL)
        g_error ("%s: “%s” does not name “%s”", w, error->message, cases[i].expect);
    }
  {
    g_autoptr(LaminaTargetSet) set = invented_targets ();
    g_autoptr(GError) error = NULL;

    g_assert_true (lamina_target_set_validate (set, NULL, NULL));
    lamina_target_set_add (set, lamina_target_new ("roof", 0.2));
    g_assert_false (lamina_target_set_validate (set, NULL, &error));
    g_assert_nonnull (strstr (error->message, "“roof” is given twice"));
  }
}

/* Moisture criteria of a target (EN ISO 13788:2012 clause 7, the monthly
 * balance; from memory).  The build-up and the figures are those worked by
 * hand in tests/core/test-moisture.c: plasterboard 12.5 mm (λ 0.25, μ 10),
 * mineral wool 150 mm (λ 0.040, μ 1), OSB 15 mm (λ 0.13, μ 30), θi 20 °C,
 * φi 0.5.  Outside −5 °C, φe 0.8 all year: condensation at the wool/OSB
 * plane from January, never drying.  fRsi = 1 − 0.25·U* with U* =
 * 1/(4.085385 − 0.13 + 0.25) = 0.237790 → 0.940552 (clause 5), not the
 * 1 − 0.25·U of the thermal U alone. */
static LaminaConstruction *
moisture_wall (void)
{
  LaminaConstruction *c = lamina_construction_new ("tw", "timber wall", LAMINA_ELEMENT_WALL);
  const struct { double d; const char *id; LaminaCategory cat; double lambda, mu; } layers[] = {
    { 12.5, "plasterboard", LAMINA_CATEGORY_BOARD, 0.25, 10 },
    { 150, "mineral-wool", LAMINA_CATEGORY_INSULATION, 0.040, 1 },
    { 15, "osb", LAMINA_CATEGORY_BOARD, 0.13, 30 },
  };

  for (guint i = 0; i < G_N_ELEMENTS (layers); i++)
    {
      LaminaLayer *layer = test_layer (layers[i].d, layers[i].id, layers[i].cat, layers[i].lambda);

      layer->material->vapour_resistance_factor = layers[i].mu;
      lamina_construction_add_layer (c, layer);
    }
  c->inside_temperature = 20;
  c->outside_temperature = -5;
  lamina_construction_set_moisture (c, lamina_moisture_settings_new ("site"));
  c->moisture->inside_humidity = 0.5;
  c->status = LAMINA_STATUS_APPROVED;
  return c;
}

typedef struct
{
  LaminaMoistureCriterion criterion;
  double                  outside;          /* °C, all year */
  gboolean                assessed;
  LaminaVerdict           moisture_verdict;
  LaminaVerdict           verdict;
  LaminaEntryFlags        flag;             /* expected among the flags */
} MoistureCase;

static void
test_moisture_criteria (void)
{
  /* U = 1/4.085385 = 0.2448 ≤ 0.30 (invented maximum) in every case, so
   * the verdict turns on the moisture criterion alone.  At +15 °C, φe
   * 0.6 the outside pressure 0.6·1705 = 1023 Pa is below the inside
   * 0.5·2337 = 1168 Pa and every plane is above 15 °C (psat ≥ 1705 Pa >
   * 1168): no condensation anywhere (clause 7). */
  static const MoistureCase cases[] = {
    { LAMINA_MOISTURE_NO_CONDENSATION, -5, TRUE, LAMINA_VERDICT_NOT_MET, LAMINA_VERDICT_NOT_MET, LAMINA_ENTRY_MOISTURE_NOT_MET },
    { LAMINA_MOISTURE_NO_ACCUMULATION, -5, TRUE, LAMINA_VERDICT_NOT_MET, LAMINA_VERDICT_NOT_MET, LAMINA_ENTRY_MOISTURE_NOT_MET },
    { LAMINA_MOISTURE_NO_CONDENSATION, 15, TRUE, LAMINA_VERDICT_MET, LAMINA_VERDICT_MET, LAMINA_ENTRY_NONE },
    { LAMINA_MOISTURE_NO_ACCUMULATION, 15, TRUE, LAMINA_VERDICT_MET, LAMINA_VERDICT_MET, LAMINA_ENTRY_NONE },
    { LAMINA_MOISTURE_NO_CONDENSATION, -5, FALSE, LAMINA_VERDICT_NOT_CALCULATED, LAMINA_VERDICT_MET, LAMINA_ENTRY_MOISTURE_OPEN },
    { LAMINA_MOISTURE_NONE, -5, TRUE, LAMINA_VERDICT_NO_TARGET, LAMINA_VERDICT_MET, LAMINA_ENTRY_NONE },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autoptr(LaminaConstruction) c = moisture_wall ();
      g_autoptr(LaminaClimate) climate = test_constant_climate (cases[i].outside, cases[i].outside < 0 ? 0.8 : 0.6);
      g_autoptr(LaminaMoistureResult) m = lamina_moisture_calculate (c, climate, NAN, NULL);
      g_autoptr(LaminaResult) r = lamina_calculate (c, NULL);
      g_autoptr(LaminaJob) job = lamina_job_new ("j", "moisture");
      g_autoptr(LaminaTargetSet) set = lamina_target_set_new ("s", "Invented test table");
      g_autoptr(LaminaJobCheck) check = NULL;
      LaminaTarget *t = lamina_target_new ("external-wall", 0.30);
      LaminaJobInput in = { c, r, 0, 0, cases[i].assessed ? m : NULL, NULL };
      const LaminaJobLine *line;

      g_assert_nonnull (m);
      t->moisture = cases[i].criterion;
      t->min_frsi = 0.75;
      lamina_target_set_add (set, t);
      lamina_job_add_entry (job, lamina_job_entry_new ("tw", 1, "external-wall"));
      check = lamina_job_check (job, set, &in, 1);
      line = check->lines->pdata[0];
      g_assert_cmpint (line->moisture_verdict, ==, cases[i].moisture_verdict);
      g_assert_cmpint (line->verdict, ==, cases[i].verdict);
      if (cases[i].flag != LAMINA_ENTRY_NONE)
        g_assert_true (line->flags & cases[i].flag);
      g_assert_false (line->flags & (cases[i].flag == LAMINA_ENTRY_NONE
                                     ? LAMINA_ENTRY_MOISTURE_NOT_MET | LAMINA_ENTRY_MOISTURE_OPEN : 0));
      g_assert_false (line->flags & LAMINA_ENTRY_FRSI_NOT_MET);
      if (cases[i].assessed)
        assert_close (line->frsi, 0.940552, 1e-6);
      else   /* without the assessment: 1 − 0.25·U, U = 0.244775 → 0.938806 */
        assert_close (line->frsi, 1 - 0.25 / 4.085385, 1e-6);
    }
}

/* The criteria on their own (clause 7): "no condensation" fails on any
 * condensing month; "no accumulation" only when condensate is left after
 * the twelve months. */
static void
test_moisture_criterion_table (void)
{
  static const struct { gboolean condensation, dries_out, no_condensation, no_accumulation; } rows[] = {
    { FALSE, TRUE, TRUE, TRUE },
    { TRUE, TRUE, FALSE, TRUE },
    { TRUE, FALSE, FALSE, FALSE },
  };

  for (guint i = 0; i < G_N_ELEMENTS (rows); i++)
    {
      LaminaMoistureResult r = { 0 };

      r.condensation = rows[i].condensation;
      r.dries_out = rows[i].dries_out;
      g_assert_cmpint (lamina_moisture_criterion_met (LAMINA_MOISTURE_NO_CONDENSATION, &r), ==, rows[i].no_condensation);
      g_assert_cmpint (lamina_moisture_criterion_met (LAMINA_MOISTURE_NO_ACCUMULATION, &r), ==, rows[i].no_accumulation);
      g_assert_true (lamina_moisture_criterion_met (LAMINA_MOISTURE_NONE, &r));
    }
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/job/compliance-per-use", test_compliance_per_use);
  g_test_add_func ("/core/job/heat-loss-hand-sum", test_heat_loss_hand_sum);
  g_test_add_func ("/core/job/frsi-and-flags", test_frsi_and_flags);
  g_test_add_func ("/core/job/pins-and-moves", test_pins_and_moves);
  g_test_add_func ("/core/job/b-prime", test_b_prime);
  g_test_add_func ("/core/job/ground-floor", test_ground_floor);
  g_test_add_func ("/core/job/copy-equal", test_copy_equal);
  g_test_add_func ("/core/job/conditions", test_conditions);
  g_test_add_func ("/core/job/refusals", test_refusals);
  g_test_add_func ("/core/job/moisture-criteria", test_moisture_criteria);
  g_test_add_func ("/core/job/moisture-criterion-table", test_moisture_criterion_table);
  return g_test_run ();
}
