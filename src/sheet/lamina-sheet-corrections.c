/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sheet-corrections.c: the corrections that make up ΔU, itemised
 * by layer with the values they were worked from (EN ISO 6946:2017
 * Annex F), so that a checker can repeat each one. */
#define G_LOG_DOMAIN "lamina-sheet"

#include "lamina-sheet-private.h"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "lamina-sheet-format.h"

static void
append_fasteners (GString                 *text,
                  const LaminaLayer       *layer,
                  const LaminaLayerResult *lr)
{
  const LaminaCorrections *k = &layer->corrections;
  char n[LAMINA_FORMAT_SIZE], a[LAMINA_FORMAT_SIZE], dia[LAMINA_FORMAT_SIZE];
  char l[LAMINA_FORMAT_SIZE], du[LAMINA_FORMAT_SIZE], d1[LAMINA_FORMAT_SIZE], d0[LAMINA_FORMAT_SIZE];
  g_autofree char *penetration = NULL;

  lamina_format_fixed (l, k->fastener_conductivity, k->fastener_conductivity >= 10 ? 0 : 2);
  if (k->fastener_conductivity < 1.0)
    {
      g_string_append_printf (text, _("fasteners (F.3): λf %s W/(m·K), below 1 W/(m·K): no correction"), l);
      return;
    }
  /* Whole numbers, or one decimal where the value has one. */
  lamina_format_thickness (n, k->fasteners_per_square_metre);
  lamina_format_thickness (a, k->fastener_cross_section);
  /* The round shank of that cross-section: how fasteners are specified. */
  lamina_format_fixed (dia, sqrt (4 * k->fastener_cross_section / G_PI), 1);
  lamina_format_fixed (du, lr->delta_u_fasteners, 4);
  if (isnan (k->fastener_penetration))
    penetration = g_strdup (_("through the layer (α 0.8)"));
  else
    penetration = g_strdup_printf (_("recessed, %s of %s mm (α 0.8 × d1/d0)"),
                                   lamina_format_thickness (d1, k->fastener_penetration),
                                   lamina_format_thickness (d0, layer->thickness));
  g_string_append_printf (text, _("fasteners (F.3): %s per m², %s mm² each (⌀ %s mm), λf %s W/(m·K), %s: "
                                  "ΔUf = %s W/(m²·K)"),
                          n, a, dia, l, penetration, du);
}

static void
append_layer (GString                 *text,
              const LaminaLayer       *layer,
              const LaminaLayerResult *lr,
              guint                    number)
{
  const LaminaCorrections *k = &layer->corrections;
  char du[LAMINA_FORMAT_SIZE], p[LAMINA_FORMAT_SIZE], f[LAMINA_FORMAT_SIZE];
  g_autofree char *head = g_strdup_printf (_("Layer %u, %s"), number, lamina_layer_get_label (layer));

  if (k->has_air_gaps)
    {
      /* Table F.1: ΔU'' 0, 0.01 and 0.04 for levels 0, 1 and 2. */
      static const char *const level_words[] = {
        N_("no gaps across the insulation"),
        N_("gaps across the insulation, no air circulation"),
        N_("gaps with air circulation"),
      };
      int level = CLAMP (k->air_gap_level, 0, 2);

      lamina_format_fixed (du, lr->delta_u_air_gaps, 4);
      g_string_append_printf (text, "%s%s: ", text->len ? "\n" : "", head);
      g_string_append_printf (text, _("air gaps (F.2): level %d, %s: ΔUg = %s W/(m²·K)"), level,
                              _(level_words[level]), du);
    }
  if (k->has_fasteners)
    {
      g_string_append_printf (text, "%s%s: ", text->len ? "\n" : "", head);
      append_fasteners (text, layer, lr);
    }
  if (k->has_inverted_roof)
    {
      lamina_format_fixed (du, lr->delta_u_inverted_roof, 4);
      lamina_format_fixed (p, k->precipitation, 1);
      lamina_format_fixed (f, k->drainage_factor, 2);
      g_string_append_printf (text, "%s%s: ", text->len ? "\n" : "", head);
      g_string_append_printf (text, _("inverted roof (F.4): rain p %s mm/day, drainage factor f %s, "
                                      "x 0.04 W·day/(m²·K·mm): ΔUr = %s W/(m²·K)"), p, f, du);
    }
}

char *
sheet_dup_corrections_text (const LaminaConstruction *c,
                            const LaminaResult       *result)
{
  GString *text = g_string_new (NULL);
  char du[LAMINA_FORMAT_SIZE];

  for (guint i = 0; i < c->layers->len && i < result->n_layers; i++)
    {
      const LaminaLayer *layer = c->layers->pdata[i];
      const LaminaCorrections *k = &layer->corrections;

      if (!k->has_air_gaps && !k->has_fasteners && !k->has_inverted_roof)
        continue;
      if (result->layers[i].disregarded)
        continue; /* the engine says so among the notes */
      append_layer (text, layer, &result->layers[i], i + 1);
    }
  if (text->len == 0)
    return g_string_free (text, TRUE);
  lamina_format_fixed (du, result->delta_u, 4);
  g_string_append_printf (text, "\n");
  g_string_append_printf (text, _("ΔU = %s W/(m²·K): the sum of the terms above, each weighted by (R of its layer / RT)²"), du);
  return g_string_free (text, FALSE);
}
