/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-material.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "lamina-error.h"

/* More stock sizes than any product range lists; bounds untrusted input. */
#define MAX_STOCK_THICKNESSES 64

G_DEFINE_BOXED_TYPE (LaminaMaterial, lamina_material,
                     lamina_material_copy, lamina_material_free)

LaminaMaterial *
lamina_material_new (const char     *id,
                     const char     *name,
                     LaminaCategory  category,
                     double          conductivity)
{
  LaminaMaterial *m = g_new0 (LaminaMaterial, 1);

  m->id = g_strdup (id);
  m->name = g_strdup (name);
  m->category = category;
  m->conductivity = conductivity;
  m->density = NAN;
  m->specific_heat = NAN;
  m->vapour_resistance_factor = NAN;
  m->emissivity = NAN;
  return m;
}

LaminaMaterial *
lamina_material_copy (const LaminaMaterial *material)
{
  LaminaMaterial *m;

  g_return_val_if_fail (material != NULL, NULL);

  m = g_memdup2 (material, sizeof *material);
  m->id = g_strdup (material->id);
  m->name = g_strdup (material->name);
  m->source = g_strdup (material->source);
  m->notes = g_strdup (material->notes);
  m->stock_thicknesses = g_memdup2 (material->stock_thicknesses,
                                    sizeof (double) * material->n_stock_thicknesses);
  return m;
}

void
lamina_material_free (LaminaMaterial *material)
{
  if (material == NULL)
    return;
  g_free (material->id);
  g_free (material->name);
  g_free (material->source);
  g_free (material->notes);
  g_free (material->stock_thicknesses);
  g_free (material);
}

/* NAN compares equal to NAN here: "not known" is the same value. */
static gboolean
same_value (double a,
            double b)
{
  return (isnan (a) && isnan (b)) || a == b;
}

gboolean
lamina_material_equal (const LaminaMaterial *a,
                       const LaminaMaterial *b)
{
  if (a == b)
    return TRUE;
  if (a == NULL || b == NULL)
    return FALSE;
  return g_strcmp0 (a->id, b->id) == 0
         && g_strcmp0 (a->name, b->name) == 0
         && a->category == b->category
         && same_value (a->conductivity, b->conductivity)
         && same_value (a->density, b->density)
         && same_value (a->specific_heat, b->specific_heat)
         && same_value (a->vapour_resistance_factor, b->vapour_resistance_factor)
         && same_value (a->emissivity, b->emissivity)
         && g_strcmp0 (a->source, b->source) == 0
         && g_strcmp0 (a->notes, b->notes) == 0
         && a->n_stock_thicknesses == b->n_stock_thicknesses
         && (a->n_stock_thicknesses == 0
             || memcmp (a->stock_thicknesses, b->stock_thicknesses,
                        sizeof (double) * a->n_stock_thicknesses) == 0);
}

static int
compare_doubles (const void *a,
                 const void *b)
{
  double x = *(const double *) a, y = *(const double *) b;

  return (x > y) - (x < y);
}

void
lamina_material_set_stock_thicknesses (LaminaMaterial *material,
                                       const double   *thicknesses,
                                       guint           n)
{
  double *sorted;
  guint kept = 0;

  g_return_if_fail (material != NULL);
  g_return_if_fail (n == 0 || thicknesses != NULL);

  g_clear_pointer (&material->stock_thicknesses, g_free);
  material->n_stock_thicknesses = 0;
  if (n == 0)
    return;
  sorted = g_memdup2 (thicknesses, sizeof (double) * n);
  qsort (sorted, n, sizeof (double), compare_doubles);
  for (guint i = 0; i < n; i++)
    if (kept == 0 || sorted[i] != sorted[kept - 1])
      sorted[kept++] = sorted[i];
  material->stock_thicknesses = sorted;
  material->n_stock_thicknesses = kept;
}

char *
lamina_material_dup_stock_string (const LaminaMaterial *material)
{
  GString *s;

  g_return_val_if_fail (material != NULL, NULL);

  if (material->n_stock_thicknesses == 0)
    return NULL;
  s = g_string_new (NULL);
  for (guint i = 0; i < material->n_stock_thicknesses; i++)
    {
      char buf[G_ASCII_DTOSTR_BUF_SIZE];

      if (i > 0)
        g_string_append_c (s, ' ');
      g_string_append (s, g_ascii_formatd (buf, sizeof buf, "%.10g", material->stock_thicknesses[i]));
    }
  return g_string_free (s, FALSE);
}

gboolean
lamina_material_parse_stock_string (LaminaMaterial *material,
                                    const char     *text,
                                    GError        **error)
{
  g_auto(GStrv) items = NULL;
  double values[MAX_STOCK_THICKNESSES];
  guint n = 0;

  g_return_val_if_fail (material != NULL, FALSE);

  items = g_strsplit_set (text != NULL ? text : "", " \t\n\r,;", -1);
  for (guint i = 0; items[i] != NULL; i++)
    {
      char *end = NULL;
      double v;

      if (items[i][0] == '\0')
        continue;
      v = g_ascii_strtod (items[i], &end);
      if (end == items[i] || *end != '\0' || !isfinite (v) || v <= 0 || v > 10000)
        {
          g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID,
                       _("stock thickness “%s” is not a thickness in mm between 0 and 10000"), items[i]);
          return FALSE;
        }
      if (n == MAX_STOCK_THICKNESSES)
        {
          g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID,
                       _("more than %d stock thicknesses"), MAX_STOCK_THICKNESSES);
          return FALSE;
        }
      values[n++] = v;
    }
  lamina_material_set_stock_thicknesses (material, values, n);
  return TRUE;
}
