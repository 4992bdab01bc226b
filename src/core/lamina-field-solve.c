/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Two-dimensional steady-state conduction, EN ISO 10211:2017: the grid,
 * the finite-volume equations and the preconditioned conjugate gradients.
 *
 * Nodes sit on the grid lines, materials fill the cells between them.  The
 * control volume of a node reaches halfway to its neighbours, so the link
 * from node (i, j) to (i + 1, j) crosses the half cells below and above it:
 *
 *   C = (λx(i, j−1)·hy(j−1)/2 + λx(i, j)·hy(j)/2) / hx(i)      [W/(m·K)]
 *
 * which is exact for materials that are constant per cell (no averaging of
 * conductivities across a material boundary is needed, because no link
 * crosses one).  A side with surface resistance Rs adds, per node, the face
 * length / Rs towards the environment; a side held at a temperature (Rs 0)
 * fixes its nodes; an adiabatic side adds nothing. */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-field.h"
#include "lamina-calc-private.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

/* Growth of the spacing away from a material line. */
#define GRADING 1.3
/* How often the iteration reports progress and looks for a cancel. */
#define PROGRESS_EVERY 16
/* MIC(0): the share of the dropped fill-in moved to the diagonal.  1 keeps
 * the row sums (the classic modified factorisation): on the steel-stud
 * test wall it needs 279 iterations at 245,000 cells where 0.9 needs 752
 * and plain IC(0) 825.  Tiny pivots are guarded in factorise (). */
#define MIC_OMEGA 1.0
#define MAX_MATERIALS 255

G_DEFINE_QUARK (lamina-field-error-quark, lamina_field_error)

typedef struct
{
  double x0, y0, x1, y1;
  guint  material;
} Rect;

typedef struct
{
  gboolean set;
  double   resistance;
  double   temperature;
} Boundary;

struct _LaminaFieldModel
{
  double   width, height;
  GArray  *lambda_x, *lambda_y;  /* double per material */
  GArray  *rects;                /* Rect */
  GArray  *points_x, *points_y;  /* double */
  Boundary side[LAMINA_FIELD_N_SIDES];
  double   coarse, fine;
};

LaminaFieldModel *
lamina_field_model_new (double width,
                        double height)
{
  LaminaFieldModel *model = g_new0 (LaminaFieldModel, 1);

  model->width = width;
  model->height = height;
  model->lambda_x = g_array_new (FALSE, FALSE, sizeof (double));
  model->lambda_y = g_array_new (FALSE, FALSE, sizeof (double));
  model->rects = g_array_new (FALSE, FALSE, sizeof (Rect));
  model->points_x = g_array_new (FALSE, FALSE, sizeof (double));
  model->points_y = g_array_new (FALSE, FALSE, sizeof (double));
  model->coarse = MAX (width, height) / 30.0;
  model->fine = model->coarse / 10.0;
  return model;
}

void
lamina_field_model_free (LaminaFieldModel *model)
{
  if (model == NULL)
    return;
  g_array_unref (model->lambda_x);
  g_array_unref (model->lambda_y);
  g_array_unref (model->rects);
  g_array_unref (model->points_x);
  g_array_unref (model->points_y);
  g_free (model);
}

guint
lamina_field_model_add_material (LaminaFieldModel *model,
                                 double            conductivity_x,
                                 double            conductivity_y)
{
  g_return_val_if_fail (model->lambda_x->len < MAX_MATERIALS, 0);
  g_array_append_val (model->lambda_x, conductivity_x);
  g_array_append_val (model->lambda_y, conductivity_y);
  return model->lambda_x->len - 1;
}

void
lamina_field_model_add_rectangle (LaminaFieldModel *model,
                                  double            x0,
                                  double            y0,
                                  double            x1,
                                  double            y1,
                                  guint             material)
{
  Rect r = { MAX (0.0, MIN (x0, x1)), MAX (0.0, MIN (y0, y1)),
             MIN (model->width, MAX (x0, x1)), MIN (model->height, MAX (y0, y1)), material };

  g_return_if_fail (material < model->lambda_x->len);
  g_array_append_val (model->rects, r);
}

void
lamina_field_model_set_boundary (LaminaFieldModel *model,
                                 LaminaFieldSide   side,
                                 double            resistance,
                                 double            temperature)
{
  g_return_if_fail ((guint) side < LAMINA_FIELD_N_SIDES);
  model->side[side].set = TRUE;
  model->side[side].resistance = resistance;
  model->side[side].temperature = temperature;
}

void
lamina_field_model_add_point (LaminaFieldModel *model,
                              double            x,
                              double            y)
{
  g_array_append_val (model->points_x, x);
  g_array_append_val (model->points_y, y);
}

void
lamina_field_model_set_spacing (LaminaFieldModel *model,
                                double            coarse,
                                double            fine)
{
  model->coarse = coarse;
  model->fine = MIN (fine, coarse);
}

/* ---- Grid ------------------------------------------------------------ */

static int
compare_double (gconstpointer a,
                gconstpointer b)
{
  double x = *(const double *) a, y = *(const double *) b;
  return (x > y) - (x < y);
}

/* The material lines along one axis, sorted, without near-duplicates. */
static GArray *
material_lines (const LaminaFieldModel *model,
                gboolean                along_x)
{
  GArray *lines = g_array_new (FALSE, FALSE, sizeof (double));
  double extent = along_x ? model->width : model->height;
  double zero = 0.0, eps = extent * 1e-9;
  GArray *points = along_x ? model->points_x : model->points_y;
  guint n = 0;

  g_array_append_val (lines, zero);
  g_array_append_val (lines, extent);
  for (guint k = 0; k < model->rects->len; k++)
    {
      const Rect *r = &g_array_index (model->rects, Rect, k);
      double lo = along_x ? r->x0 : r->y0, hi = along_x ? r->x1 : r->y1;
      g_array_append_val (lines, lo);
      g_array_append_val (lines, hi);
    }
  for (guint k = 0; k < points->len; k++)
    {
      double p = g_array_index (points, double, k);
      if (p > 0 && p < extent)
        g_array_append_val (lines, p);
    }
  g_array_sort (lines, compare_double);
  for (guint k = 0; k < lines->len; k++)
    {
      double v = g_array_index (lines, double, k);
      if (n == 0 || v - g_array_index (lines, double, n - 1) > eps)
        g_array_index (lines, double, n++) = v;
    }
  g_array_set_size (lines, n);
  return lines;
}

/* Splits [a, b] with spacing growing from @fine at both ends towards
 * @coarse in the middle; appends the inner points and b. */
static void
grade_interval (GArray *out,
                double  a,
                double  b,
                double  coarse,
                double  fine)
{
  double left = a, right = b, h = fine;
  GArray *tail = g_array_new (FALSE, FALSE, sizeof (double));
  guint n;

  while (right - left > 3.0 * h && h < coarse)
    {
      left += h;
      right -= h;
      g_array_append_val (out, left);
      g_array_append_val (tail, right);
      h = MIN (h * GRADING, coarse);
    }
  n = (guint) MAX (1.0, ceil ((right - left) / h - 1e-9));
  for (guint k = 1; k < n; k++)
    {
      double v = left + (right - left) * k / n;
      g_array_append_val (out, v);
    }
  for (guint k = tail->len; k > 0; k--)
    g_array_append_val (out, g_array_index (tail, double, k - 1));
  g_array_append_val (out, b);
  g_array_unref (tail);
}

static double *
grid_axis (const LaminaFieldModel *model,
           gboolean                along_x,
           guint                   level,
           guint                  *n_out)
{
  g_autoptr (GArray) lines = material_lines (model, along_x);
  g_autoptr (GArray) base = g_array_new (FALSE, FALSE, sizeof (double));
  double *axis;
  guint n, split = 1u << level;

  g_array_append_val (base, g_array_index (lines, double, 0));
  for (guint k = 1; k < lines->len; k++)
    grade_interval (base, g_array_index (lines, double, k - 1), g_array_index (lines, double, k),
                    model->coarse, model->fine);
  n = (base->len - 1) * split + 1;
  axis = g_new (double, n);
  for (guint k = 0; k + 1 < base->len; k++)
    {
      double a = g_array_index (base, double, k), b = g_array_index (base, double, k + 1);
      for (guint s = 0; s < split; s++)
        axis[k * split + s] = a + (b - a) * s / split;
    }
  axis[n - 1] = g_array_index (base, double, base->len - 1);
  *n_out = n;
  return axis;
}

static guint
lower_index (const double *axis,
             guint         n,
             double        v)
{
  guint lo = 0, hi = n - 1;

  /* The last node at or below v (within rounding). */
  while (hi - lo > 1)
    {
      guint mid = (lo + hi) / 2;
      if (axis[mid] <= v + 1e-12 * fabs (v) + 1e-15)
        lo = mid;
      else
        hi = mid;
    }
  if (axis[hi] <= v + 1e-12 * fabs (v) + 1e-15)
    lo = hi;
  return lo;
}

/* ---- Solution ---------------------------------------------------------- */

void
lamina_field_solution_free (LaminaFieldSolution *solution)
{
  if (solution == NULL)
    return;
  g_free (solution->x);
  g_free (solution->y);
  g_free (solution->t);
  g_free (solution->material);
  g_free (solution);
}

guint
lamina_field_solution_get_cells (const LaminaFieldSolution *s)
{
  return (s->nx - 1) * (s->ny - 1);
}

double
lamina_field_solution_get_throughput (const LaminaFieldSolution *s)
{
  double sum = 0.0;

  for (guint k = 0; k < LAMINA_FIELD_N_SIDES; k++)
    sum += fabs (s->heat_flow[k]);
  return sum / 2.0;
}

double
lamina_field_solution_temperature_at (const LaminaFieldSolution *s,
                                      double                     x,
                                      double                     y)
{
  guint i, j;
  double fx, fy;
  const double *t = s->t;

  if (x < s->x[0] - 1e-12 || x > s->x[s->nx - 1] + 1e-12
      || y < s->y[0] - 1e-12 || y > s->y[s->ny - 1] + 1e-12)
    return NAN;
  i = MIN (lower_index (s->x, s->nx, x), s->nx - 2);
  j = MIN (lower_index (s->y, s->ny, y), s->ny - 2);
  fx = CLAMP ((x - s->x[i]) / (s->x[i + 1] - s->x[i]), 0.0, 1.0);
  fy = CLAMP ((y - s->y[j]) / (s->y[j + 1] - s->y[j]), 0.0, 1.0);
  return (1 - fy) * ((1 - fx) * t[j * s->nx + i] + fx * t[j * s->nx + i + 1])
         + fy * ((1 - fx) * t[(j + 1) * s->nx + i] + fx * t[(j + 1) * s->nx + i + 1]);
}

/* ---- Equations --------------------------------------------------------- */

typedef struct
{
  guint   nx, ny;
  gsize   n;
  double *ce, *cn;      /* links east and north, full (for heat flows) */
  double *se, *sn;      /* links of the system; 0 next to a fixed node */
  double *diag;
  double *rhs;
  double *ge, *te;      /* boundary conductance and temperature per node */
  guint8 *fixed;
  guint8 *side_of;      /* which side a boundary node's flow counts for */
  gboolean any_fixed;
} System;

static void
system_clear (System *sys)
{
  if (sys->se != sys->ce)
    g_free (sys->se);
  if (sys->sn != sys->cn)
    g_free (sys->sn);
  g_free (sys->ce);
  g_free (sys->cn);
  g_free (sys->diag);
  g_free (sys->rhs);
  g_free (sys->ge);
  g_free (sys->te);
  g_free (sys->fixed);
  g_free (sys->side_of);
}

static gboolean
paint_cells (const LaminaFieldModel *model,
             LaminaFieldSolution    *s,
             GError                **error)
{
  guint cx = s->nx - 1, cy = s->ny - 1;

  memset (s->material, 0xff, (gsize) cx * cy);
  for (guint k = 0; k < model->rects->len; k++)
    {
      const Rect *r = &g_array_index (model->rects, Rect, k);
      guint i0 = lower_index (s->x, s->nx, r->x0), i1 = lower_index (s->x, s->nx, r->x1);
      guint j0 = lower_index (s->y, s->ny, r->y0), j1 = lower_index (s->y, s->ny, r->y1);

      for (guint j = j0; j < j1 && j < cy; j++)
        memset (s->material + (gsize) j * cx + i0, (int) r->material, i1 - i0);
    }
  for (guint j = 0; j < cy; j++)
    for (guint i = 0; i < cx; i++)
      if (s->material[(gsize) j * cx + i] == 0xff)
        {
          g_set_error (error, LAMINA_FIELD_ERROR, LAMINA_FIELD_ERROR_GEOMETRY,
                       _("no material at x %g m, y %g m of the 2-D model"),
                       (s->x[i] + s->x[i + 1]) / 2, (s->y[j] + s->y[j + 1]) / 2);
          return FALSE;
        }
  return TRUE;
}

static void
add_boundary (const LaminaFieldModel *model,
              System                 *sys,
              const LaminaFieldSolution *s,
              LaminaFieldSide         side,
              gsize                   p,
              double                  length)
{
  const Boundary *b = &model->side[side];

  if (!b->set)
    return;
  if (b->resistance <= 0.0)
    {
      /* Where two held sides meet, the corner takes their mean. */
      if (sys->fixed[p])
        sys->te[p] = (sys->te[p] + b->temperature) / 2.0;
      else
        {
          sys->te[p] = b->temperature;
          sys->side_of[p] = (guint8) side;
        }
      sys->fixed[p] = 1;
      sys->any_fixed = TRUE;
      return;
    }
  (void) s;
  if (sys->fixed[p])
    return;
  /* A Robin corner node belongs to two sides: keep the flows apart by
   * side through one combined conductance is not possible, so corners
   * split theirs by face length in heat_flows (). */
  sys->ge[p * 2 + (side >= LAMINA_FIELD_SIDE_LEFT)] += length / b->resistance;
}

/* The conductances between neighbouring nodes, summed over the half
 * cells beside each link (exact for cell-wise materials), and the
 * boundaries' conductances or held temperatures. */
static void
add_conductances (const LaminaFieldModel    *model,
                  const LaminaFieldSolution *s,
                  System                    *sys)
{
  guint nx = s->nx, ny = s->ny, cx = nx - 1;
  const double *lx = (const double *) model->lambda_x->data;
  const double *ly = (const double *) model->lambda_y->data;

  for (guint j = 0; j < ny; j++)
    for (guint i = 0; i < nx; i++)
      {
        gsize p = (gsize) j * nx + i;
        double hxl = i > 0 ? s->x[i] - s->x[i - 1] : 0.0;
        double hxr = i + 1 < nx ? s->x[i + 1] - s->x[i] : 0.0;
        double hyb = j > 0 ? s->y[j] - s->y[j - 1] : 0.0;
        double hyt = j + 1 < ny ? s->y[j + 1] - s->y[j] : 0.0;

        if (i + 1 < nx)
          {
            double c = 0.0;
            if (j > 0)
              c += lx[s->material[(gsize) (j - 1) * cx + i]] * hyb / 2;
            if (j + 1 < ny)
              c += lx[s->material[(gsize) j * cx + i]] * hyt / 2;
            sys->ce[p] = c / hxr;
          }
        if (j + 1 < ny)
          {
            double c = 0.0;
            if (i > 0)
              c += ly[s->material[(gsize) j * cx + i - 1]] * hxl / 2;
            if (i + 1 < nx)
              c += ly[s->material[(gsize) j * cx + i]] * hxr / 2;
            sys->cn[p] = c / hyt;
          }
        if (j == 0)
          add_boundary (model, sys, s, LAMINA_FIELD_SIDE_BOTTOM, p, (hxl + hxr) / 2);
        if (j + 1 == ny)
          add_boundary (model, sys, s, LAMINA_FIELD_SIDE_TOP, p, (hxl + hxr) / 2);
        if (i == 0)
          add_boundary (model, sys, s, LAMINA_FIELD_SIDE_LEFT, p, (hyb + hyt) / 2);
        if (i + 1 == nx)
          add_boundary (model, sys, s, LAMINA_FIELD_SIDE_RIGHT, p, (hyb + hyt) / 2);
      }
}

/* Held nodes are their own equation (T = te): their links leave the
 * symmetric matrix and go to the right-hand side of their neighbours. */
static void
hold_fixed_nodes (System *sys)
{
  gsize nx = sys->nx;

  /* The environment temperature of Robin nodes (sides meeting at a Robin
   * corner have their own temperatures, so keep g·T per node). */
  sys->se = sys->ce;
  sys->sn = sys->cn;
  if (sys->any_fixed)
    {
      sys->se = g_memdup2 (sys->ce, sizeof (double) * sys->n);
      sys->sn = g_memdup2 (sys->cn, sizeof (double) * sys->n);
    }
  for (gsize p = 0; p < sys->n; p++)
    {
      if (sys->fixed[p])
        {
          sys->diag[p] = 1.0;
          sys->rhs[p] = sys->te[p];
          sys->se[p] = 0.0;
          sys->sn[p] = 0.0;
          if (p >= 1 && (p % nx) != 0)
            sys->se[p - 1] = 0.0;
          if (p >= nx)
            sys->sn[p - nx] = 0.0;
        }
    }
}

/* Each free node's diagonal: the sum of its conductances, with the held
 * neighbours' and the environments' temperatures on the right. */
static void
add_diagonal (const LaminaFieldModel *model,
              System                 *sys)
{
  guint nx = sys->nx, ny = sys->ny;

  for (guint j = 0; j < ny; j++)
    for (guint i = 0; i < nx; i++)
      {
        gsize p = (gsize) j * nx + i;
        double d = 0.0;

        if (sys->fixed[p])
          continue;
        if (i + 1 < nx)
          {
            d += sys->ce[p];
            if (sys->fixed[p + 1])
              sys->rhs[p] += sys->ce[p] * sys->te[p + 1];
          }
        if (i > 0)
          {
            d += sys->ce[p - 1];
            if (sys->fixed[p - 1])
              sys->rhs[p] += sys->ce[p - 1] * sys->te[p - 1];
          }
        if (j + 1 < ny)
          {
            d += sys->cn[p];
            if (sys->fixed[p + nx])
              sys->rhs[p] += sys->cn[p] * sys->te[p + nx];
          }
        if (j > 0)
          {
            d += sys->cn[p - nx];
            if (sys->fixed[p - nx])
              sys->rhs[p] += sys->cn[p - nx] * sys->te[p - nx];
          }
        for (guint k = 0; k < 2; k++)
          {
            LaminaFieldSide side;
            double g = sys->ge[p * 2 + k];

            if (g == 0.0)
              continue;
            if (k == 0)
              side = j == 0 ? LAMINA_FIELD_SIDE_BOTTOM : LAMINA_FIELD_SIDE_TOP;
            else
              side = i == 0 ? LAMINA_FIELD_SIDE_LEFT : LAMINA_FIELD_SIDE_RIGHT;
            d += g;
            sys->rhs[p] += g * model->side[side].temperature;
          }
        sys->diag[p] = d;
      }
}

static void
build_system (const LaminaFieldModel    *model,
              const LaminaFieldSolution *s,
              System                    *sys)
{
  sys->nx = s->nx;
  sys->ny = s->ny;
  sys->n = (gsize) s->nx * s->ny;
  sys->ce = g_new0 (double, sys->n);
  sys->cn = g_new0 (double, sys->n);
  sys->diag = g_new0 (double, sys->n);
  sys->rhs = g_new0 (double, sys->n);
  /* Two boundary conductances per node: one for bottom/top, one for left/right. */
  sys->ge = g_new0 (double, sys->n * 2);
  sys->te = g_new0 (double, sys->n);
  sys->fixed = g_new0 (guint8, sys->n);
  sys->side_of = g_new0 (guint8, sys->n);
  add_conductances (model, s, sys);
  hold_fixed_nodes (sys);
  add_diagonal (model, sys);
}

static void
multiply (const System *sys,
          const double *v,
          double       *out)
{
  guint nx = sys->nx;
  gsize n = sys->n;
  const double *se = sys->se, *sn = sys->sn, *diag = sys->diag;

  for (gsize p = 0; p < n; p++)
    {
      double a = diag[p] * v[p];

      if (p + 1 < n)
        a -= se[p] * v[p + 1];
      if (p >= 1)
        a -= se[p - 1] * v[p - 1];
      if (p + nx < n)
        a -= sn[p] * v[p + nx];
      if (p >= nx)
        a -= sn[p - nx] * v[p - nx];
      out[p] = a;
    }
}

/* Modified incomplete Cholesky, no fill-in: A ≈ (D − L) D⁻¹ (D − Lᵀ), with
 * L the west and south links.  The dropped fill-in at the diagonal
 * neighbours goes to the pivot (×ω), which keeps the row sums and makes
 * the condition number grow like h⁻¹ instead of h⁻². */
static void
factorise (const System *sys,
           double       *pivot)
{
  guint nx = sys->nx;
  const double *se = sys->se, *sn = sys->sn;

  for (gsize p = 0; p < sys->n; p++)
    {
      double d = sys->diag[p];

      if (p >= 1)
        {
          double cw = se[p - 1];
          if (cw != 0.0)
            d -= (cw * cw + MIC_OMEGA * cw * sn[p - 1]) / pivot[p - 1];
        }
      if (p >= nx)
        {
          double cs = sn[p - nx];
          if (cs != 0.0)
            d -= (cs * cs + MIC_OMEGA * cs * se[p - nx]) / pivot[p - nx];
        }
      /* A pivot that collapsed falls back to the plain diagonal. */
      if (!(d > 1e-3 * sys->diag[p]))
        d = sys->diag[p];
      pivot[p] = d;
    }
}

static void
precondition (const System *sys,
              const double *pivot,
              const double *r,
              double       *z)
{
  guint nx = sys->nx;
  gsize n = sys->n;
  const double *se = sys->se, *sn = sys->sn;

  for (gsize p = 0; p < n; p++)
    {
      double v = r[p];
      if (p >= 1)
        v += se[p - 1] * z[p - 1];
      if (p >= nx)
        v += sn[p - nx] * z[p - nx];
      z[p] = v / pivot[p];
    }
  for (gsize p = n; p-- > 0;)
    {
      double v = 0.0;
      if (p + 1 < n)
        v += se[p] * z[p + 1];
      if (p + nx < n)
        v += sn[p] * z[p + nx];
      z[p] += v / pivot[p];
    }
}

static double
dot (const double *a,
     const double *b,
     gsize         n)
{
  double s = 0.0;

  for (gsize p = 0; p < n; p++)
    s += a[p] * b[p];
  return s;
}

static gboolean
conjugate_gradients (const System        *sys,
                     double              *x,
                     LaminaFieldProgress  progress,
                     gpointer             user_data,
                     guint               *iterations,
                     double              *residual,
                     GError             **error)
{
  gsize n = sys->n;
  g_autofree double *pivot = g_new (double, n);
  g_autofree double *r = g_new (double, n);
  g_autofree double *z = g_new (double, n);
  g_autofree double *d = g_new (double, n);
  g_autofree double *q = g_new (double, n);
  double norm_b = sqrt (dot (sys->rhs, sys->rhs, n));
  double goal, rz, start;
  guint max_iterations = 20000, k;

  factorise (sys, pivot);
  multiply (sys, x, q);
  for (gsize p = 0; p < n; p++)
    r[p] = sys->rhs[p] - q[p];
  if (norm_b == 0.0)
    norm_b = 1.0;
  goal = LAMINA_FIELD_SOLVER_TOLERANCE * norm_b;
  start = sqrt (dot (r, r, n));
  precondition (sys, pivot, r, z);
  memcpy (d, z, sizeof (double) * n);
  rz = dot (r, z, n);

  for (k = 0; k < max_iterations; k++)
    {
      double norm_r = sqrt (dot (r, r, n)), alpha, beta, rz_new;

      if (norm_r <= goal)
        break;
      if (progress != NULL && k % PROGRESS_EVERY == 0 && start > goal)
        {
          double done = log (start / MAX (norm_r, goal)) / log (start / goal);
          if (!progress (CLAMP (done, 0.0, 1.0), user_data))
            {
              g_set_error_literal (error, LAMINA_FIELD_ERROR, LAMINA_FIELD_ERROR_CANCELLED,
                                   _("The 2-D calculation was cancelled."));
              return FALSE;
            }
        }
      multiply (sys, d, q);
      alpha = rz / dot (d, q, n);
      for (gsize p = 0; p < n; p++)
        {
          x[p] += alpha * d[p];
          r[p] -= alpha * q[p];
        }
      precondition (sys, pivot, r, z);
      rz_new = dot (r, z, n);
      beta = rz_new / rz;
      rz = rz_new;
      for (gsize p = 0; p < n; p++)
        d[p] = z[p] + beta * d[p];
    }
  *iterations = k;
  *residual = sqrt (dot (r, r, n)) / norm_b;
  if (k == max_iterations)
    {
      g_set_error (error, LAMINA_FIELD_ERROR, LAMINA_FIELD_ERROR_NOT_CONVERGED,
                   _("the 2-D solver did not reach its tolerance in %u iterations"), max_iterations);
      return FALSE;
    }
  return TRUE;
}

/* Heat flow into the body through each side, W/m. */
static void
heat_flows (const LaminaFieldModel *model,
            const System           *sys,
            LaminaFieldSolution    *s)
{
  guint nx = sys->nx, ny = sys->ny;

  memset (s->heat_flow, 0, sizeof s->heat_flow);
  for (guint j = 0; j < ny; j++)
    for (guint i = 0; i < nx; i++)
      {
        gsize p = (gsize) j * nx + i;
        double t = s->t[p];

        if (sys->fixed[p])
          {
            /* What the held node gives its neighbours. */
            double q = 0.0;
            if (i + 1 < nx)
              q += sys->ce[p] * (t - s->t[p + 1]);
            if (i > 0)
              q += sys->ce[p - 1] * (t - s->t[p - 1]);
            if (j + 1 < ny)
              q += sys->cn[p] * (t - s->t[p + nx]);
            if (j > 0)
              q += sys->cn[p - nx] * (t - s->t[p - nx]);
            s->heat_flow[sys->side_of[p]] += q;
            continue;
          }
        if (sys->ge[p * 2] != 0.0)
          {
            LaminaFieldSide side = j == 0 ? LAMINA_FIELD_SIDE_BOTTOM : LAMINA_FIELD_SIDE_TOP;
            s->heat_flow[side] += sys->ge[p * 2] * (model->side[side].temperature - t);
          }
        if (sys->ge[p * 2 + 1] != 0.0)
          {
            LaminaFieldSide side = i == 0 ? LAMINA_FIELD_SIDE_LEFT : LAMINA_FIELD_SIDE_RIGHT;
            s->heat_flow[side] += sys->ge[p * 2 + 1] * (model->side[side].temperature - t);
          }
      }
}

LaminaFieldSolution *
lamina_field_model_dup_system (const LaminaFieldModel *model,
                               guint                   level,
                               double                **diagonal,
                               double                **east,
                               double                **north,
                               double                **rhs,
                               GError                **error)
{
  g_autoptr (LaminaFieldSolution) s = g_new0 (LaminaFieldSolution, 1);
  System sys = { 0 };

  s->x = grid_axis (model, TRUE, level, &s->nx);
  s->y = grid_axis (model, FALSE, level, &s->ny);
  s->material = g_new (guint8, (gsize) (s->nx - 1) * (s->ny - 1));
  if (!paint_cells (model, s, error))
    return NULL;
  build_system (model, s, &sys);
  *diagonal = g_steal_pointer (&sys.diag);
  *rhs = g_steal_pointer (&sys.rhs);
  *east = g_memdup2 (sys.se, sizeof (double) * sys.n);
  *north = g_memdup2 (sys.sn, sizeof (double) * sys.n);
  system_clear (&sys);
  return g_steal_pointer (&s);
}

LaminaFieldSolution *
lamina_field_model_solve_level (const LaminaFieldModel    *model,
                                guint                      level,
                                const LaminaFieldSolution *guess,
                                LaminaFieldProgress        progress,
                                gpointer                   user_data,
                                GError                   **error)
{
  g_autoptr (LaminaFieldSolution) s = g_new0 (LaminaFieldSolution, 1);
  System sys = { 0 };
  gboolean ok;

  if (!(model->width > 0) || !(model->height > 0))
    {
      g_set_error_literal (error, LAMINA_FIELD_ERROR, LAMINA_FIELD_ERROR_GEOMETRY,
                           _("the 2-D model has no extent"));
      return NULL;
    }
  s->x = grid_axis (model, TRUE, level, &s->nx);
  s->y = grid_axis (model, FALSE, level, &s->ny);
  s->material = g_new (guint8, (gsize) (s->nx - 1) * (s->ny - 1));
  s->t = g_new0 (double, (gsize) s->nx * s->ny);
  if (!paint_cells (model, s, error))
    return NULL;
  build_system (model, s, &sys);

  for (guint j = 0; j < s->ny; j++)
    for (guint i = 0; i < s->nx; i++)
      {
        gsize p = (gsize) j * s->nx + i;
        if (sys.fixed[p])
          s->t[p] = sys.te[p];
        else if (guess != NULL)
          s->t[p] = lamina_field_solution_temperature_at (guess, s->x[i], s->y[j]);
      }
  ok = conjugate_gradients (&sys, s->t, progress, user_data, &s->iterations, &s->residual, error);
  if (ok)
    heat_flows (model, &sys, s);
  system_clear (&sys);
  return ok ? g_steal_pointer (&s) : NULL;
}

gboolean
lamina_progress_share (double   fraction,
                       gpointer user_data)
{
  LaminaProgressShare *share = user_data;
  return share->progress (share->base + share->share * fraction, share->user_data);
}

LaminaFieldSolution *
lamina_field_model_solve (const LaminaFieldModel *model,
                          guint                   max_nodes,
                          LaminaFieldRefinement  *refinement,
                          LaminaFieldProgress     progress,
                          gpointer                user_data,
                          GError                **error)
{
  LaminaFieldSolution *best = NULL;
  LaminaFieldRefinement local;
  LaminaFieldRefinement *ref = refinement ? refinement : &local;
  LaminaProgressShare stage = { progress, user_data, 0.0, 0.0 };

  if (max_nodes == 0)
    max_nodes = LAMINA_FIELD_MAX_NODES;
  memset (ref, 0, sizeof *ref);
  for (guint level = 0; level < LAMINA_FIELD_MAX_LEVELS; level++)
    {
      LaminaFieldSolution *next;
      double flow;

      /* Each halving has four times the nodes: assume the next grid costs
       * four times the work of all before it, and the one after likewise. */
      if (best != NULL && (gsize) (2 * best->nx - 1) * (2 * best->ny - 1) > max_nodes)
        break;
      stage.base = level == 0 ? 0.0 : 0.2;
      stage.share = level == 0 ? 0.2 : 0.8;
      if (level >= 2)
        {
          stage.base = 0.2 + 0.8 * (1.0 - pow (0.25, level - 1));
          stage.share = 0.8 * pow (0.25, level - 1) * 0.75;
        }
      next = lamina_field_model_solve_level (model, level, best, progress ? lamina_progress_share : NULL,
                                             &stage, error);
      if (next == NULL)
        {
          lamina_field_solution_free (best);
          return NULL;
        }
      flow = lamina_field_solution_get_throughput (next);
      ref->cells[ref->n_levels] = lamina_field_solution_get_cells (next);
      ref->throughput[ref->n_levels] = flow;
      ref->iterations[ref->n_levels] = next->iterations;
      ref->n_levels++;
      if (best != NULL)
        {
          double previous = lamina_field_solution_get_throughput (best);
          ref->change = flow != 0.0 ? fabs (flow - previous) / fabs (flow) : 0.0;
          ref->converged = ref->change < LAMINA_FIELD_CONVERGENCE;
        }
      lamina_field_solution_free (best);
      best = next;
      if (ref->converged)
        break;
    }
  if (progress != NULL)
    progress (1.0, user_data);
  return best;
}
