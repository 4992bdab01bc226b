/* SPDX-License-Identifier: GPL-3.0-or-later */
/* One month of the interstitial condensation calculation, EN ISO 13788:2012
 * clause 7 (the Glaser method; clause numbers from memory).
 *
 * The vapour pressure is a straight line against cumulative sd between the
 * points where it is fixed: pi at the inner surface, pe at the outer surface,
 * and psat at every plane that holds moisture from earlier months (7.3.3,
 * evaporation and continued condensation).  Where that line would rise above
 * psat at a plane in between, the tangent construction (7.3.2) pulls it down
 * to the tightest line that stays at or below psat: the lower convex hull of
 * the points (sd, psat) between the two fixed ends, whose corners are the
 * condensation planes.  The net flux at a plane is the flux arriving minus
 * the flux leaving, g = δ0·Δp/Δsd on each side. */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-moisture.h"

#include <math.h>

/* z-component of (b − o) × (c − o): positive when o→b→c turns left. */
static double
cross (const double *x,
       const double *y,
       guint         o,
       guint         b,
       guint         c)
{
  return (x[b] - x[o]) * (y[c] - y[o]) - (y[b] - y[o]) * (x[c] - x[o]);
}

/* Tangent construction between fixed points @a and @b: marks the corners of
 * the lower convex hull of the points a…b as fixed.  @y holds the ends'
 * pressures at a and b and psat in between.  @stack has room for b − a + 1. */
static void
fix_hull (const double *sd,
          const double *y,
          guint         a,
          guint         b,
          gboolean     *fixed,
          guint        *stack)
{
  guint top = 0;

  for (guint k = a; k <= b; k++)
    {
      while (top >= 2 && cross (sd, y, stack[top - 2], stack[top - 1], k) <= 0.0)
        top--;
      stack[top++] = k;
    }
  for (guint k = 1; k + 1 < top; k++)
    fixed[stack[k]] = TRUE;
}

static double
line_at (const double *sd,
         const double *p,
         guint         a,
         guint         b,
         guint         k)
{
  return p[a] + (p[b] - p[a]) * (sd[k] - sd[a]) / (sd[b] - sd[a]);
}

/* Does the straight line from a to b rise above psat at a point between? */
static gboolean
line_exceeds (const double *sd,
              const double *saturation,
              const double *p,
              guint         a,
              guint         b)
{
  for (guint k = a + 1; k < b; k++)
    if (line_at (sd, p, a, b, k) > saturation[k])
      return TRUE;
  return FALSE;
}

static guint
next_fixed (const gboolean *fixed,
            guint           from)
{
  guint k = from + 1;

  while (!fixed[k])
    k++;
  return k;
}

gboolean
lamina_glaser_month (guint         n,
                     const double *sd,
                     const double *saturation,
                     double        inside_pressure,
                     double        outside_pressure,
                     double        seconds,
                     double       *accumulation,
                     double       *pressure)
{
  g_autofree gboolean *fixed = g_new0 (gboolean, n);
  g_autofree guint *stack = g_new (guint, n);
  gboolean condenses = FALSE;

  g_return_val_if_fail (n >= 2, FALSE);

  /* The ends, and every plane still holding moisture, sit where they must. */
  fixed[0] = fixed[n - 1] = TRUE;
  for (guint j = 1; j + 1 < n; j++)
    {
      fixed[j] = accumulation[j] > 0.0;
      pressure[j] = saturation[j];
    }
  pressure[0] = inside_pressure;
  pressure[n - 1] = outside_pressure;

  /* 7.3.2: new condensation planes by the tangent construction, segment by
   * segment between the fixed points; a hull's corners are at psat, so the
   * new segments stay below it. */
  for (guint a = 0; a + 1 < n; )
    {
      guint b = next_fixed (fixed, a);

      if (line_exceeds (sd, saturation, pressure, a, b))
        fix_hull (sd, pressure, a, b, fixed, stack);
      a = b;
    }

  /* The line between the fixed points, and the net flux at each plane. */
  for (guint a = 0; a + 1 < n; )
    {
      guint b = next_fixed (fixed, a);

      for (guint k = a + 1; k < b; k++)
        pressure[k] = line_at (sd, pressure, a, b, k);
      if (b + 1 < n)
        {
          guint c = next_fixed (fixed, b);
          double in = LAMINA_VAPOUR_PERMEABILITY_AIR * (pressure[a] - pressure[b]) / (sd[b] - sd[a]);
          double out = LAMINA_VAPOUR_PERMEABILITY_AIR * (pressure[b] - pressure[c]) / (sd[c] - sd[b]);
          double net = in - out;

          if (net > 0.0)
            condenses = TRUE;
          /* 7.3.3: evaporation takes at most what is there; the plane is dry
           * from then on (the month is not split at that moment). */
          accumulation[b] = MAX (0.0, accumulation[b] + net * seconds);
        }
      a = b;
    }
  accumulation[0] = accumulation[n - 1] = 0.0;
  return condenses;
}
