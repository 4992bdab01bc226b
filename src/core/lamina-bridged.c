/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Sections of a construction with bridged layers (EN ISO 6946:2017 6.7.2).
 *
 * Bridged layers form patterns.  Layers whose parts name the same framing
 * member belong to one pattern: the member runs straight through them, so
 * each member is one section of the pattern and the remaining area (the
 * background) another, in which every layer shows its infill.  A bridged
 * layer that shares no member with another is a pattern of its own whose
 * sections are its parts.  Patterns are independent of each other (crossing
 * battens): the sections of the construction are every combination, with
 * the product of the fractions. */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-calc-private.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#define TOLERANCE 1e-6

typedef struct
{
  guint   n_sections;
  double *fraction;     /* per section of the pattern */
  GArray *layers;       /* guint: layer indices in the pattern */
  guint8 *choice;       /* n_sections × layers->len: part per layer */
} Pattern;

static guint
find_root (guint *parent,
           guint  i)
{
  while (parent[i] != i)
    {
      parent[i] = parent[parent[i]];
      i = parent[i];
    }
  return i;
}

static gboolean
layers_share_member (const LaminaLayer *a,
                     const LaminaLayer *b)
{
  for (guint p = 0; p < a->parts->len; p++)
    {
      const LaminaPart *pa = a->parts->pdata[p];

      if (pa->member == NULL)
        continue;
      for (guint q = 0; q < b->parts->len; q++)
        {
          const LaminaPart *pb = b->parts->pdata[q];
          if (pb->member != NULL && strcmp (pa->member, pb->member) == 0)
            return TRUE;
        }
    }
  return FALSE;
}

static int
find_part (const LaminaLayer *layer,
           const char        *member)
{
  for (guint p = 0; p < layer->parts->len; p++)
    {
      const LaminaPart *part = layer->parts->pdata[p];
      if (g_strcmp0 (part->member, member) == 0)
        return (int) p;
    }
  return -1;
}

/* A pattern of one layer without named members: its parts are the sections. */
static void
build_plain_pattern (const LaminaLayer *layer,
                     Pattern           *pattern)
{
  pattern->n_sections = layer->parts->len;
  pattern->fraction = g_new (double, pattern->n_sections);
  pattern->choice = g_new (guint8, pattern->n_sections);
  for (guint p = 0; p < layer->parts->len; p++)
    {
      pattern->fraction[p] = lamina_layer_get_part_fraction (layer, p);
      pattern->choice[p] = (guint8) p;
    }
}

static gboolean
build_member_pattern (const LaminaConstruction *c,
                      Pattern                  *pattern,
                      GError                  **error)
{
  g_autoptr(GPtrArray) names = g_ptr_array_new ();
  g_autoptr(GArray) fractions = g_array_new (FALSE, FALSE, sizeof (double));
  guint n_layers = pattern->layers->len;
  double sum = 0.0;
  gboolean background;

  for (guint k = 0; k < n_layers; k++)
    {
      const LaminaLayer *layer = c->layers->pdata[g_array_index (pattern->layers, guint, k)];

      for (guint p = 0; p < layer->parts->len; p++)
        {
          const LaminaPart *part = layer->parts->pdata[p];
          gboolean known = FALSE;

          if (part->member == NULL)
            continue;
          for (guint m = 0; m < names->len && !known; m++)
            known = strcmp (names->pdata[m], part->member) == 0;
          if (!known)
            {
              double f = lamina_layer_get_part_fraction (layer, p);
              g_ptr_array_add (names, part->member);
              g_array_append_val (fractions, f);
              sum += f;
            }
        }
    }
  if (sum > 1.0 + TOLERANCE)
    {
      g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID,
                   _("layer %u: the framing members that line up through its layers cover a fraction %g, more than 1"),
                   g_array_index (pattern->layers, guint, 0) + 1, sum);
      return FALSE;
    }
  background = 1.0 - sum > TOLERANCE;
  pattern->n_sections = names->len + (background ? 1 : 0);
  pattern->fraction = g_new (double, pattern->n_sections);
  pattern->choice = g_new (guint8, pattern->n_sections * n_layers);
  for (guint s = 0; s < pattern->n_sections; s++)
    {
      const char *member = s < names->len ? names->pdata[s] : NULL;

      pattern->fraction[s] = member ? g_array_index (fractions, double, s) : 1.0 - sum;
      for (guint k = 0; k < n_layers; k++)
        {
          guint index = g_array_index (pattern->layers, guint, k);
          const LaminaLayer *layer = c->layers->pdata[index];
          int part = member ? find_part (layer, member) : -1;

          if (part < 0)
            part = find_part (layer, NULL);
          if (part < 0)
            {
              g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID,
                           _("layer %u: every part names a framing member, so nothing fills the area of %s%s%s "
                             "that runs through the neighbouring layers; add an infill part without a member"),
                           index + 1, member ? "“" : "", member ? member : _("the infill"), member ? "”" : "");
              return FALSE;
            }
          pattern->choice[s * n_layers + k] = (guint8) part;
        }
    }
  return TRUE;
}

static void
clear_pattern (Pattern *pattern)
{
  g_free (pattern->fraction);
  g_free (pattern->choice);
  if (pattern->layers != NULL)
    g_array_unref (pattern->layers);
}

static gboolean
pattern_has_members (const LaminaConstruction *c,
                     const Pattern            *pattern)
{
  for (guint k = 0; k < pattern->layers->len; k++)
    {
      const LaminaLayer *layer = c->layers->pdata[g_array_index (pattern->layers, guint, k)];
      for (guint p = 0; p < layer->parts->len; p++)
        if (((LaminaPart *) layer->parts->pdata[p])->member != NULL)
          return TRUE;
    }
  return FALSE;
}

static GArray *
group_patterns (const LaminaConstruction *c)
{
  guint n = c->layers->len;
  g_autofree guint *parent = g_new (guint, n);
  GArray *patterns = g_array_new (FALSE, TRUE, sizeof (Pattern));
  g_autofree int *pattern_of_root = g_new (int, n);

  for (guint i = 0; i < n; i++)
    {
      parent[i] = i;
      pattern_of_root[i] = -1;
    }
  for (guint i = 0; i < n; i++)
    {
      const LaminaLayer *a = c->layers->pdata[i];
      if (a->kind != LAMINA_LAYER_BRIDGED)
        continue;
      for (guint j = i + 1; j < n; j++)
        {
          const LaminaLayer *b = c->layers->pdata[j];
          if (b->kind == LAMINA_LAYER_BRIDGED && layers_share_member (a, b))
            parent[find_root (parent, j)] = find_root (parent, i);
        }
    }
  for (guint i = 0; i < n; i++)
    {
      guint root;
      Pattern *pattern;

      if (((LaminaLayer *) c->layers->pdata[i])->kind != LAMINA_LAYER_BRIDGED)
        continue;
      root = find_root (parent, i);
      if (pattern_of_root[root] < 0)
        {
          Pattern fresh = { 0, NULL, g_array_new (FALSE, FALSE, sizeof (guint)), NULL };
          pattern_of_root[root] = (int) patterns->len;
          g_array_append_val (patterns, fresh);
        }
      pattern = &g_array_index (patterns, Pattern, pattern_of_root[root]);
      g_array_append_val (pattern->layers, i);
    }
  return patterns;
}

gboolean
lamina_sections_build (const LaminaConstruction *c,
                       LaminaSections           *sections,
                       GError                  **error)
{
  g_autoptr(GArray) patterns = group_patterns (c);
  guint n_layers = c->layers->len;
  guint total = 1;
  gboolean ok = TRUE;

  memset (sections, 0, sizeof *sections);
  sections->n_layers = n_layers;

  for (guint k = 0; k < patterns->len && ok; k++)
    {
      Pattern *pattern = &g_array_index (patterns, Pattern, k);

      if (pattern_has_members (c, pattern))
        ok = build_member_pattern (c, pattern, error);
      else
        build_plain_pattern (c->layers->pdata[g_array_index (pattern->layers, guint, 0)], pattern);
      if (ok && total * pattern->n_sections > LAMINA_MAX_SECTIONS)
        {
          g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_UNSUPPORTED,
                       _("the bridged layers combine into more than %d heat-flow sections; "
                         "simplify the build-up or calculate it numerically (EN ISO 10211)"),
                       LAMINA_MAX_SECTIONS);
          ok = FALSE;
        }
      if (ok)
        total *= pattern->n_sections;
    }

  if (ok)
    {
      sections->n_sections = total;
      sections->fraction = g_new (double, total);
      sections->choice = g_new0 (guint8, (gsize) total * n_layers);
      /* Enumerate every combination in mixed radix over the patterns. */
      for (guint s = 0; s < total; s++)
        {
          guint rest = s;
          double f = 1.0;

          for (guint k = 0; k < patterns->len; k++)
            {
              const Pattern *pattern = &g_array_index (patterns, Pattern, k);
              guint digit = rest % pattern->n_sections;

              rest /= pattern->n_sections;
              f *= pattern->fraction[digit];
              for (guint l = 0; l < pattern->layers->len; l++)
                {
                  guint index = g_array_index (pattern->layers, guint, l);
                  sections->choice[(gsize) s * n_layers + index] =
                    pattern->choice[digit * pattern->layers->len + l];
                }
            }
          sections->fraction[s] = f;
        }
    }

  for (guint k = 0; k < patterns->len; k++)
    clear_pattern (&g_array_index (patterns, Pattern, k));
  return ok;
}

void
lamina_sections_clear (LaminaSections *sections)
{
  g_clear_pointer (&sections->fraction, g_free);
  g_clear_pointer (&sections->choice, g_free);
  sections->n_sections = 0;
}
