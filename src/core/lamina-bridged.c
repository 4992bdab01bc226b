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
 * the product of the fractions.  The standard names no rule for crossing
 * patterns; the product (independent placement) is this program's
 * reading of 6.7.2.
 *
 * All working memory comes from the calculation's scratch arena. */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-calc-private.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#define TOLERANCE 1e-6

typedef struct
{
  guint        n_layers;
  guint       *layers;       /* layer indices in the pattern */
  gboolean     has_members;
  guint        n_sections;
  double      *fraction;     /* per section */
  guint8      *choice;       /* n_sections × n_layers: part per layer */
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
                     LaminaScratch     *scratch,
                     Pattern           *pattern)
{
  pattern->n_sections = layer->parts->len;
  pattern->fraction = lamina_scratch_alloc (scratch, sizeof (double) * pattern->n_sections);
  pattern->choice = lamina_scratch_alloc (scratch, pattern->n_sections);
  for (guint p = 0; p < layer->parts->len; p++)
    {
      pattern->fraction[p] = lamina_layer_get_part_fraction (layer, p);
      pattern->choice[p] = (guint8) p;
    }
}

static gboolean
build_member_pattern (const LaminaConstruction *c,
                      LaminaScratch            *scratch,
                      Pattern                  *pattern,
                      GError                  **error)
{
  guint max_names = 0, n_names = 0;
  const char **names;
  double *fractions;
  double sum = 0.0;
  gboolean background;

  for (guint k = 0; k < pattern->n_layers; k++)
    max_names += ((LaminaLayer *) c->layers->pdata[pattern->layers[k]])->parts->len;
  names = lamina_scratch_alloc (scratch, sizeof (char *) * max_names);
  fractions = lamina_scratch_alloc (scratch, sizeof (double) * max_names);

  for (guint k = 0; k < pattern->n_layers; k++)
    {
      const LaminaLayer *layer = c->layers->pdata[pattern->layers[k]];

      for (guint p = 0; p < layer->parts->len; p++)
        {
          const LaminaPart *part = layer->parts->pdata[p];
          gboolean known = FALSE;

          if (part->member == NULL)
            continue;
          for (guint m = 0; m < n_names && !known; m++)
            known = strcmp (names[m], part->member) == 0;
          if (!known)
            {
              fractions[n_names] = lamina_layer_get_part_fraction (layer, p);
              sum += fractions[n_names];
              names[n_names++] = part->member;
            }
        }
    }
  if (sum > 1.0 + TOLERANCE)
    {
      g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID,
                   _("layer %u: the framing members that line up through its layers cover a fraction %g, more than 1"),
                   pattern->layers[0] + 1, sum);
      return FALSE;
    }
  background = 1.0 - sum > TOLERANCE;
  pattern->n_sections = n_names + (background ? 1 : 0);
  pattern->fraction = lamina_scratch_alloc (scratch, sizeof (double) * pattern->n_sections);
  pattern->choice = lamina_scratch_alloc (scratch, (gsize) pattern->n_sections * pattern->n_layers);
  for (guint s = 0; s < pattern->n_sections; s++)
    {
      const char *member = s < n_names ? names[s] : NULL;

      pattern->fraction[s] = member ? fractions[s] : 1.0 - sum;
      for (guint k = 0; k < pattern->n_layers; k++)
        {
          guint index = pattern->layers[k];
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
          pattern->choice[s * pattern->n_layers + k] = (guint8) part;
        }
    }
  return TRUE;
}

gboolean
lamina_layer_has_members (const LaminaLayer *layer)
{
  for (guint p = 0; p < layer->parts->len; p++)
    if (((LaminaPart *) layer->parts->pdata[p])->member != NULL)
      return TRUE;
  return FALSE;
}

/* Groups the bridged layers into patterns; returns their number. */
static guint
group_patterns (const LaminaConstruction *c,
                LaminaScratch            *scratch,
                Pattern                 **out)
{
  guint n = c->layers->len, n_patterns = 0, used = 0;
  guint *parent = lamina_scratch_alloc (scratch, sizeof (guint) * n);
  int *pattern_of_root = lamina_scratch_alloc (scratch, sizeof (int) * n);
  guint *members_of = lamina_scratch_alloc (scratch, sizeof (guint) * n);
  Pattern *patterns = lamina_scratch_alloc (scratch, sizeof (Pattern) * n);

  for (guint i = 0; i < n; i++)
    {
      parent[i] = i;
      pattern_of_root[i] = -1;
    }
  for (guint i = 0; i < n; i++)
    {
      const LaminaLayer *a = c->layers->pdata[i];
      if (a->kind != LAMINA_LAYER_BRIDGED || !lamina_layer_has_members (a))
        continue;
      for (guint j = i + 1; j < n; j++)
        {
          const LaminaLayer *b = c->layers->pdata[j];
          if (b->kind == LAMINA_LAYER_BRIDGED && layers_share_member (a, b))
            parent[find_root (parent, j)] = find_root (parent, i);
        }
    }
  /* Count the layers of each pattern, then hand out slices of one array. */
  for (guint i = 0; i < n; i++)
    {
      guint root;

      if (((LaminaLayer *) c->layers->pdata[i])->kind != LAMINA_LAYER_BRIDGED)
        continue;
      root = find_root (parent, i);
      if (pattern_of_root[root] < 0)
        pattern_of_root[root] = (int) n_patterns++;
      members_of[pattern_of_root[root]]++;
    }
  for (guint k = 0; k < n_patterns; k++)
    {
      patterns[k].layers = lamina_scratch_alloc (scratch, sizeof (guint) * members_of[k]);
      used += members_of[k];
    }
  for (guint i = 0; i < n; i++)
    {
      const LaminaLayer *layer = c->layers->pdata[i];
      Pattern *pattern;

      if (layer->kind != LAMINA_LAYER_BRIDGED)
        continue;
      pattern = &patterns[pattern_of_root[find_root (parent, i)]];
      pattern->layers[pattern->n_layers++] = i;
      pattern->has_members |= lamina_layer_has_members (layer);
    }
  g_assert (used <= n);
  *out = patterns;
  return n_patterns;
}

gboolean
lamina_sections_build (const LaminaConstruction *c,
                       LaminaScratch            *scratch,
                       LaminaSections           *sections,
                       GError                  **error)
{
  Pattern *patterns = NULL;
  guint n_patterns = group_patterns (c, scratch, &patterns);
  guint n_layers = c->layers->len;
  guint total = 1;

  memset (sections, 0, sizeof *sections);
  sections->n_layers = n_layers;

  for (guint k = 0; k < n_patterns; k++)
    {
      Pattern *pattern = &patterns[k];

      if (!pattern->has_members)
        build_plain_pattern (c->layers->pdata[pattern->layers[0]], scratch, pattern);
      else if (!build_member_pattern (c, scratch, pattern, error))
        return FALSE;
      if (total * pattern->n_sections > LAMINA_MAX_SECTIONS)
        {
          g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_UNSUPPORTED,
                       _("the bridged layers combine into more than %d heat-flow sections; "
                         "simplify the build-up or calculate it numerically (EN ISO 10211)"),
                       LAMINA_MAX_SECTIONS);
          return FALSE;
        }
      total *= pattern->n_sections;
    }

  sections->n_sections = total;
  sections->fraction = lamina_scratch_alloc (scratch, sizeof (double) * total);
  sections->choice = lamina_scratch_alloc (scratch, (gsize) total * n_layers);
  /* Enumerate every combination in mixed radix over the patterns. */
  for (guint s = 0; s < total; s++)
    {
      guint rest = s;
      double f = 1.0;

      for (guint k = 0; k < n_patterns; k++)
        {
          const Pattern *pattern = &patterns[k];
          guint digit = rest % pattern->n_sections;

          rest /= pattern->n_sections;
          f *= pattern->fraction[digit];
          for (guint l = 0; l < pattern->n_layers; l++)
            sections->choice[(gsize) s * n_layers + pattern->layers[l]] =
              pattern->choice[digit * pattern->n_layers + l];
        }
      sections->fraction[s] = f;
    }
  return TRUE;
}
