/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sheet-method.c: the blocks of a sheet for the rest of the method:
 * a ground floor's U with the ground for the stated plan and its table of
 * U against B′ (EN ISO 13370), so that one sheet serves many buildings;
 * and the lines that say how a tapered layer (EN ISO 6946 Annex E), an
 * unheated space (6.10) and other surface or air-layer conditions
 * (Annexes C, D) entered the figures. */
#define G_LOG_DOMAIN "lamina-sheet"

#include "lamina-sheet-private.h"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "lamina-sheet-format.h"

#define HEADING 13.0
#define ROW     11.5
#define GAP     14.0

static const char *
get_ground_kind_label (LaminaGroundKind kind)
{
  switch (kind)
    {
    case LAMINA_GROUND_SUSPENDED: return _("Suspended floor over a ventilated space (9.3)");
    case LAMINA_GROUND_BASEMENT: return _("Floor of a heated basement (9.4)");
    case LAMINA_GROUND_SLAB:
    case LAMINA_N_GROUND_KINDS:
    default: return _("Slab on ground (9.1)");
    }
}

/* The plan and what the method made of it, in one paragraph. */
static char *
dup_ground_text (const LaminaConstruction *c,
                 const LaminaResult       *r)
{
  const LaminaGround *g = &c->ground;
  const LaminaGroundResult *gr = &r->ground;
  char a[LAMINA_FORMAT_SIZE], p[LAMINA_FORMAT_SIZE], b[LAMINA_FORMAT_SIZE], w[LAMINA_FORMAT_SIZE];
  char l[LAMINA_FORMAT_SIZE], dt[LAMINA_FORMAT_SIZE], u[LAMINA_FORMAT_SIZE], x[LAMINA_FORMAT_SIZE];
  GString *text = g_string_new (NULL);

  lamina_format_fixed (a, g->area, 1);
  lamina_format_fixed (p, g->perimeter, 1);
  lamina_format_fixed (b, gr->b_prime, 2);
  lamina_format_thickness (w, g->wall_thickness);
  lamina_format_fixed (l, gr->soil_conductivity, 1);
  lamina_format_fixed (dt, gr->dt, 2);
  g_string_append_printf (text, _("%s. Plan: A %s m², exposed perimeter P %s m, B′ = A/(0.5 P) = %s m; "
                                  "walls %s mm; ground λ %s W/(m·K)%s; dt %s m."),
                          get_ground_kind_label (g->kind), a, p, b, w, l,
                          gr->soil_assumed ? _(" (soil not known: assumed)") : "", dt);
  if (g->kind == LAMINA_GROUND_SUSPENDED)
    {
      char uf[LAMINA_FORMAT_SIZE], ug[LAMINA_FORMAT_SIZE];

      lamina_format_fixed (x, gr->u_exchange, 3);
      g_string_append_printf (text, _(" Floor Uf %s, ground Ug %s, underfloor exchange Ux %s W/(m²·K)."),
                              lamina_format_fixed (uf, gr->u_floor, 3), lamina_format_fixed (ug, gr->u_ground, 3), x);
    }
  if (g->kind == LAMINA_GROUND_BASEMENT && !isnan (gr->u_walls))
    {
      char z[LAMINA_FORMAT_SIZE], uw[LAMINA_FORMAT_SIZE];

      g_string_append_printf (text, _(" Depth z %s m; basement walls Ubw %s, floor and walls together "
                                      "U′ %s W/(m²·K)."),
                              lamina_format_fixed (z, g->depth, 2), lamina_format_fixed (uw, gr->u_walls, 3),
                              lamina_format_u (u, gr->u_basement));
    }
  if (g->edge != LAMINA_EDGE_NONE)
    {
      char d[LAMINA_FORMAT_SIZE], u0[LAMINA_FORMAT_SIZE];

      g_string_append_printf (text, _(" %s edge insulation %s m (Annex B): ΔΨ %s W/(m·K), U %s without it."),
                              g->edge == LAMINA_EDGE_HORIZONTAL ? _("Horizontal") : _("Vertical"),
                              lamina_format_fixed (d, g->edge_size, 2),
                              lamina_format_fixed (x, gr->delta_psi, 3), lamina_format_u (u0, gr->u_without_edge));
    }
  g_string_append_printf (text, _(" U with the ground %s W/(m²·K) for this plan; for another building read "
                                  "the table by its B′."),
                          lamina_format_u (u, gr->u));
  return g_string_free (text, FALSE);
}

double
sheet_measure_ground (SheetContext             *ctx,
                      const LaminaConstruction *c,
                      const LaminaResult       *r)
{
  g_autofree char *text = NULL;
  double h;

  if (!r->has_ground)
    return 0;
  text = dup_ground_text (c, r);
  sheet_text_set (ctx, SHEET_FONT_BODY, text, ctx->right - ctx->left, NULL, &h);
  return HEADING + h + 4 + 2 * ROW + GAP;
}

double
sheet_draw_ground (SheetContext             *ctx,
                   const LaminaConstruction *c,
                   const LaminaResult       *r,
                   double                    y)
{
  g_autofree char *text = NULL;
  double table[LAMINA_GROUND_TABLE_ROWS];
  double first = 70, cell, x;
  char v[LAMINA_FORMAT_SIZE];

  if (!r->has_ground)
    return y;
  text = dup_ground_text (c, r);
  sheet_text_line (ctx, SHEET_FONT_HEADING, _("Ground floor, EN ISO 13370:2017"), ctx->left, y, 0, PANGO_ALIGN_LEFT);
  y += HEADING;
  y += sheet_text (ctx, SHEET_FONT_BODY, text, ctx->left, y, ctx->right - ctx->left, PANGO_ALIGN_LEFT) + 4;

  /* U against B′: one row of B′, one of U. */
  lamina_result_ground_table (c, r, table);
  cell = (ctx->right - ctx->left - first) / LAMINA_GROUND_TABLE_ROWS;
  sheet_text_line (ctx, SHEET_FONT_BOLD, _("B′ m"), ctx->left, y, first, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_BOLD, _("U W/(m²·K)"), ctx->left, y + ROW, first, PANGO_ALIGN_LEFT);
  for (guint i = 0; i < LAMINA_GROUND_TABLE_ROWS; i++)
    {
      x = ctx->left + first + (i + 1) * cell;
      sheet_text_line (ctx, SHEET_FONT_BODY, lamina_format_fixed (v, lamina_ground_table_b_prime[i], 0),
                       x - 4, y, 0, PANGO_ALIGN_RIGHT);
      sheet_text_line (ctx, SHEET_FONT_BODY, lamina_format_u (v, table[i]), x - 4, y + ROW, 0, PANGO_ALIGN_RIGHT);
    }
  sheet_rule (ctx, y + ROW - 1, 0.4, 0.6);
  sheet_rule (ctx, y + 2 * ROW, 0.4, 0.6);
  return y + 2 * ROW + GAP;
}

/* Tapered layer, unheated space, Annex C/D: NULL when none applies. */
char *
sheet_dup_method_text (const LaminaConstruction *c,
                       const LaminaResult       *r)
{
  GString *text = g_string_new (NULL);
  const LaminaSurfaceConditions *s = &c->surfaces;
  char a[LAMINA_FORMAT_SIZE], b[LAMINA_FORMAT_SIZE], d[LAMINA_FORMAT_SIZE], e[LAMINA_FORMAT_SIZE];
  char f[LAMINA_FORMAT_SIZE], g[LAMINA_FORMAT_SIZE], h[LAMINA_FORMAT_SIZE];

  if (r->tapered)
    {
      const LaminaLayer *layer = c->layers->pdata[r->tapered_layer - 1];
      static const char *const shapes[] = {
        "", N_("rectangle sloping one way"), N_("triangle, thickest at the apex"),
        N_("triangle, thinnest at the apex"),
      };

      g_string_append_printf (text, _("Layer %u, %s, tapered (Annex E), %s: thickness %s mm at the thin end to "
                                      "%s mm at the thick end; R0 %s m²·K/W (the rest with Rsi, Rse and the thin "
                                      "end), R1 %s m²·K/W (the wedge); U %s at the thin end to %s at the thick "
                                      "end; area-average U = %s W/(m²·K)."),
                              r->tapered_layer, lamina_layer_get_label (layer),
                              _(shapes[CLAMP (layer->taper, 0, LAMINA_N_TAPERS - 1)]),
                              lamina_format_thickness (a, layer->thickness),
                              lamina_format_thickness (b, layer->thickness_max),
                              lamina_format_fixed (d, r->tapered_r0, 3), lamina_format_fixed (e, r->tapered_r1, 3),
                              lamina_format_u (f, r->u_thin_end), lamina_format_u (g, r->u_thick_end),
                              lamina_format_u (h, r->u));
    }
  if (r->r_unheated > 0)
    {
      lamina_format_fixed (a, r->r_unheated, 3);
      if (c->unheated.kind == LAMINA_UNHEATED_ROOF_SPACE)
        g_string_append_printf (text, _("%sRoof space outside: Ru %s m²·K/W by roof type (6.10.2, Table 9), "
                                        "included in RT."), text->len ? "\n" : "", a);
      else
        g_string_append_printf (text, _("%sUnheated space outside: Ru = Ai/(Σ Ae·Ue + 0.33 n V) = %s m²·K/W "
                                        "(6.10.3), included in RT."), text->len ? "\n" : "", a);
    }
  if (!isnan (s->wind_speed) || !isnan (s->emissivity_inside) || !isnan (s->emissivity_outside))
    g_string_append_printf (text, _("%sSurface resistances by Annex C: wind %s m/s, emissivity inside %s and "
                                    "outside %s."), text->len ? "\n" : "",
                            lamina_format_fixed (a, isnan (s->wind_speed) ? 4.0 : s->wind_speed, 1),
                            lamina_format_fixed (b, isnan (s->emissivity_inside) ? 0.9 : s->emissivity_inside, 2),
                            lamina_format_fixed (d, isnan (s->emissivity_outside) ? 0.9 : s->emissivity_outside, 2));
  if (s->air_from_profile)
    g_string_append_printf (text, _("%sAir layers by Annex D at the temperature difference of their own "
                                    "profile under the design conditions (%u rounds)."),
                            text->len ? "\n" : "", r->air_iterations);
  if (text->len == 0)
    return g_string_free (text, TRUE);
  return g_string_free (text, FALSE);
}
