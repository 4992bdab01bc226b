/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sheet-job.c: a job's sheet set — the cover, the schedule checked
 * against the job's targets with U·A and H_T, and the band with the job
 * above each construction's sheet. */
#define G_LOG_DOMAIN "lamina-sheet"

#include "lamina-sheet-private.h"

#include <cairo-pdf.h>
#include <glib/gi18n-lib.h>
#include <math.h>

#include "lamina-sheet-format.h"

#define ROW       14.0
#define NOTE_ROW  10.0
#define HEAD      62.0   /* title and column labels of a schedule page */

static void
set_grey (SheetContext *ctx)
{
  cairo_set_source_rgb (ctx->cr, ctx->grey, ctx->grey, ctx->grey);
}

static void
set_black (SheetContext *ctx)
{
  cairo_set_source_rgb (ctx->cr, 0, 0, 0);
}

static const char *
job_status_label (LaminaJobStatus status)
{
  switch (status)
    {
    case LAMINA_JOB_STATUS_SUBMITTED:
      return _("Submitted");
    case LAMINA_JOB_STATUS_BUILT:
      return _("Built");
    case LAMINA_JOB_STATUS_DESIGN:
    case LAMINA_N_JOB_STATUSES:
    default:
      return _("Design");
    }
}

static const char *
verdict_label (LaminaVerdict verdict)
{
  switch (verdict)
    {
    case LAMINA_VERDICT_MET:
      return _("yes");
    case LAMINA_VERDICT_NOT_MET:
      return _("NO");
    case LAMINA_VERDICT_NO_TARGET:
      return _("no target");
    case LAMINA_VERDICT_NOT_CALCULATED:
    case LAMINA_N_VERDICTS:
    default:
      return _("—");
    }
}

/* The band */

double
sheet_draw_job_band (SheetContext *ctx,
                     double        y)
{
  const LaminaSheetJob *job = ctx->options->job;
  const char *use = ctx->job_line ? ctx->job_line->entry->use : job->use;
  double w = ctx->right - ctx->left;
  g_autofree char *left = g_strdup_printf ("%s%s%s", job->number ? job->number : "",
                                           job->number ? "  " : "", job->name ? job->name : "");
  g_autofree char *right = NULL;

  if (job->client && use)
    right = g_strdup_printf (_("Client: %s · Use: %s"), job->client, use);
  else if (job->client)
    right = g_strdup_printf (_("Client: %s"), job->client);
  else if (use)
    right = g_strdup_printf (_("Use: %s"), use);
  cairo_set_source_rgb (ctx->cr, 0.9, 0.9, 0.9);
  cairo_rectangle (ctx->cr, ctx->left, y, w, 15);
  cairo_fill (ctx->cr);
  set_black (ctx);
  sheet_text_line (ctx, SHEET_FONT_BOLD, left, ctx->left + 6, y + 3, w * 0.45 - 12, PANGO_ALIGN_LEFT);
  if (right)
    sheet_text_line (ctx, SHEET_FONT_BODY, right, ctx->left + w * 0.45, y + 3, w * 0.55 - 6,
                     PANGO_ALIGN_RIGHT);
  return y + 15 + 6;
}

char *
sheet_job_dup_criteria_text (const SheetContext *ctx)
{
  g_autofree char *moisture = ctx->job_line ? lamina_job_line_dup_criteria_text (ctx->job_line) : NULL;

  if (moisture == NULL)
    return NULL;
  return g_strdup_printf (_("The job's target for “%s”: %s"), ctx->job_line->entry->use, moisture);
}

/* The cover */

static double
draw_cover_field (SheetContext *ctx,
                  const char   *label,
                  const char   *value,
                  double        y)
{
  double w = ctx->right - ctx->left;

  set_grey (ctx);
  sheet_text_line (ctx, SHEET_FONT_LABEL, label, ctx->left, y + 2, 110, PANGO_ALIGN_LEFT);
  set_black (ctx);
  return sheet_text (ctx, SHEET_FONT_BODY, value && *value ? value : "—", ctx->left + 120, y,
                     w - 120, PANGO_ALIGN_LEFT) + 5;
}

static char *
dup_conditions (const LaminaJob *job)
{
  char inside[LAMINA_FORMAT_SIZE], outside[LAMINA_FORMAT_SIZE], b[LAMINA_FORMAT_SIZE];
  GString *text = g_string_new (NULL);

  g_string_append_printf (text, _("inside %s, outside %s"),
                          lamina_format_temperature (inside, job->inside_temperature),
                          lamina_format_temperature (outside, job->outside_temperature));
  if (job->climate)
    g_string_append_printf (text, _("; climate %s"), job->climate);
  if (!isnan (lamina_job_get_b_prime (job)))
    g_string_append_printf (text, _("; ground floor B′ = %s m (EN ISO 13370)"),
                            lamina_format_fixed (b, lamina_job_get_b_prime (job), 2));
  return g_string_free (text, FALSE);
}

static void
draw_cover (SheetContext      *ctx,
            const SheetJobSet *set)
{
  const LaminaJob *job = set->job;
  const LaminaJobCheck *check = set->check;
  double w = ctx->right - ctx->left, y = ctx->top + (ctx->bottom - ctx->top) * 0.18;
  g_autofree char *conditions = dup_conditions (job);
  g_autofree char *summary = g_strdup_printf (g_dngettext (GETTEXT_PACKAGE,
                                                           "%u entry: met %u, not met %u, without a target or figure %u",
                                                           "%u entries: met %u, not met %u, without a target or figure %u",
                                                           check->lines->len),
                                              check->lines->len, check->n_met, check->n_not_met,
                                              check->n_open);

  g_clear_pointer (&ctx->footer, g_free);
  ctx->footer = g_strdup_printf ("%s%s%s", ctx->options->practice ? ctx->options->practice : "",
                                 ctx->options->practice ? " · " : "", job->name);
  sheet_draw_frame (ctx, FALSE);
  cairo_set_line_width (ctx->cr, 2.0);
  cairo_move_to (ctx->cr, ctx->left, y - 14);
  cairo_line_to (ctx->cr, ctx->left + 60, y - 14);
  cairo_stroke (ctx->cr);
  set_grey (ctx);
  y += sheet_text (ctx, SHEET_FONT_HEADING, ctx->options->practice, ctx->left, y, w, PANGO_ALIGN_LEFT) + 6;
  y += sheet_text (ctx, SHEET_FONT_BODY, _("Job sheet set: construction schedule and specification sheets"),
                   ctx->left, y, w, PANGO_ALIGN_LEFT) + 4;
  set_black (ctx);
  y += sheet_text (ctx, SHEET_FONT_CODE, job->name, ctx->left, y, w, PANGO_ALIGN_LEFT) + 18;
  y += draw_cover_field (ctx, _("JOB NUMBER"), job->number, y);
  y += draw_cover_field (ctx, _("CLIENT"), job->client, y);
  y += draw_cover_field (ctx, _("SITE"), job->site, y);
  y += draw_cover_field (ctx, _("ARCHITECT"), job->architect, y);
  y += draw_cover_field (ctx, _("STATUS"), job_status_label (job->status), y);
  y += draw_cover_field (ctx, _("DATE"), ctx->printed, y);
  y += draw_cover_field (ctx, _("DESIGN CONDITIONS"), conditions, y);
  /* The set's name, then where its values come from: each once. */
  y += draw_cover_field (ctx, _("TARGETS"), set->targets ? set->targets->name : _("none set"), y);
  if (set->targets != NULL && set->targets->source != NULL)
    y += draw_cover_field (ctx, _("SOURCE OF TARGETS"), set->targets->source, y);
  y += 10;
  sheet_text (ctx, SHEET_FONT_BOLD, summary, ctx->left, y, w, PANGO_ALIGN_LEFT);

  set_grey (ctx);
  sheet_text (ctx, SHEET_FONT_SMALL,
              _("The targets are the values the office entered for this job; check them against the "
                "building code that applies. Each sheet states the design values and conditions it was "
                "calculated for; a sheet marked DRAFT has not been reviewed. H_T covers the fabric of the "
                "listed elements only. The figures do not replace the check of the design against product "
                "declarations, the local building code, a condensation-risk assessment and licensed "
                "professional practice."),
              ctx->left, ctx->bottom - 80, w * 0.75, PANGO_ALIGN_LEFT);
  set_black (ctx);
  sheet_draw_footer (ctx);
}

/* The schedule */

typedef struct
{
  double x_code, x_name, x_use, x_u, x_max, x_met, x_area, x_ua;
} Columns;

static Columns
get_columns (const SheetContext *ctx)
{
  double r = ctx->right;

  return (Columns) { ctx->left + 14, ctx->left + 62, r - 262, r - 150, r - 112, r - 104,
                     r - 44, r };
}

static double
line_height (const LaminaJobLine *line)
{
  g_autofree char *moisture = lamina_job_line_dup_moisture_text (line);

  return ROW + NOTE_ROW * (line->notes->len + (moisture != NULL));
}

/* Totals: areas and H_T, the mean U of each element kind, the junctions. */
static double
totals_height (const SheetJobSet *set)
{
  guint kinds = 0;

  for (guint k = 0; k < LAMINA_N_ELEMENTS; k++)
    kinds += set->check->kinds[k].area > 0;
  return 70 + ROW * (kinds + set->job->junctions->len) + (set->job->junctions->len > 0 ? 2 * ROW : 0);
}

/* On every schedule page, as the cautions close every sheet. */
static const char *
get_schedule_cautions (void)
{
  return _("Cautions. The targets are the values the office entered for this job: check them against the "
           "building code that applies. U, U·A and H_T hold for the stated design values and conditions "
           "only. H_T is the heat transmission through the fabric of the listed elements only: it includes "
           "no thermal bridges unless ψ·l entries are listed, and no ventilation or elements not listed. "
           "A moisture line is the monthly method of EN ISO 13788, not a full hygrothermal assessment. "
           "The figures do not replace the check of the design against product declarations, the local "
           "building code and licensed professional practice.");
}

static double
measure_cautions (SheetContext *ctx)
{
  double h = 0;

  sheet_text_set (ctx, SHEET_FONT_SMALL, get_schedule_cautions (), ctx->right - ctx->left, NULL, &h);
  return h;
}

static void
draw_cautions (SheetContext *ctx)
{
  double h = measure_cautions (ctx);

  set_grey (ctx);
  sheet_rule (ctx, ctx->bottom - 20 - h, 0.4, 0.6);
  sheet_text (ctx, SHEET_FONT_SMALL, get_schedule_cautions (), ctx->left, ctx->bottom - 16 - h,
              ctx->right - ctx->left, PANGO_ALIGN_LEFT);
  set_black (ctx);
}

static double
room_on_page (SheetContext *ctx)
{
  return ctx->bottom - 30 - ctx->top - HEAD - measure_cautions (ctx) - 8;
}

/* Entries that fit on each page from @first; the totals go on the last. */
static guint
count_rows (SheetContext       *ctx,
            const SheetJobSet  *set,
            guint               first,
            gboolean           *totals_fit)
{
  double room = room_on_page (ctx);
  guint i = first;

  while (i < set->check->lines->len && room >= line_height (set->check->lines->pdata[i]))
    room -= line_height (set->check->lines->pdata[i++]);
  if (i == first && i < set->check->lines->len)
    i++;  /* a row taller than a page still goes somewhere */
  *totals_fit = i == set->check->lines->len && room >= totals_height (set);
  return i - first;
}

guint
sheet_job_count_front (SheetContext      *ctx,
                       const SheetJobSet *set)
{
  guint pages = 1, first = 0;
  gboolean totals_fit = FALSE;

  do
    {
      first += count_rows (ctx, set, first, &totals_fit);
      pages++;
    }
  while (first < set->check->lines->len);
  return pages + (totals_fit ? 0 : 1);
}

static void
draw_schedule_head (SheetContext      *ctx,
                    const SheetJobSet *set,
                    gboolean           first,
                    double            *y)
{
  const Columns c = get_columns (ctx);
  double w = ctx->right - ctx->left;
  g_autofree char *title = g_strdup_printf (first ? _("Schedule and check: %s")
                                                  : _("Schedule and check: %s (continued)"),
                                            set->targets ? set->targets->name : _("no target set"));

  *y += sheet_text (ctx, SHEET_FONT_HEADING, title, ctx->left, *y, w, PANGO_ALIGN_LEFT) + 12;
  set_grey (ctx);
  sheet_text_line (ctx, SHEET_FONT_LABEL, "#", ctx->left, *y, 0, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_LABEL, _("CODE"), c.x_code, *y, 0, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_LABEL, _("NAME"), c.x_name, *y, 0, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_LABEL, _("USE"), c.x_use, *y, 0, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_LABEL, _("U"), c.x_u, *y, 0, PANGO_ALIGN_RIGHT);
  sheet_text_line (ctx, SHEET_FONT_LABEL, _("TARGET"), c.x_max, *y, 0, PANGO_ALIGN_RIGHT);
  sheet_text_line (ctx, SHEET_FONT_LABEL, _("MET"), c.x_met, *y, 0, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_LABEL, _("AREA m²"), c.x_area, *y, 0, PANGO_ALIGN_RIGHT);
  sheet_text_line (ctx, SHEET_FONT_LABEL, _("U·A W/K"), c.x_ua, *y, 0, PANGO_ALIGN_RIGHT);
  set_black (ctx);
  *y += 10;
  sheet_rule (ctx, *y, 0.6, 0);
  *y += 3;
}

static void
draw_row (SheetContext        *ctx,
          const LaminaJobLine *line,
          double              *y)
{
  const Columns c = get_columns (ctx);
  const LaminaConstruction *k = line->construction;
  char n[16], u[LAMINA_FORMAT_SIZE], max[LAMINA_FORMAT_SIZE], area[LAMINA_FORMAT_SIZE];
  char ua[LAMINA_FORMAT_SIZE];
  g_autofree char *name = NULL;
  g_autofree char *moisture = lamina_job_line_dup_moisture_text (line);

  g_snprintf (n, sizeof n, "%d", line->entry->n);
  name = g_strdup_printf ("%s%s%s (rev. %d)", k ? k->name : line->entry->construction,
                          line->entry->location ? " — " : "",
                          line->entry->location ? line->entry->location : "", line->entry->revision);
  sheet_text_line (ctx, SHEET_FONT_BODY, n, ctx->left, *y, 0, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_BOLD, k && k->code ? k->code : line->entry->construction, c.x_code, *y,
                   c.x_name - c.x_code - 4, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_BODY, name, c.x_name, *y, c.x_use - c.x_name - 6, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_BODY, line->entry->use, c.x_use, *y, c.x_u - c.x_use - 30,
                   PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_BODY, isnan (line->u) ? "—" : lamina_format_fixed (u, line->u, 3),
                   c.x_u, *y, 0, PANGO_ALIGN_RIGHT);
  sheet_text_line (ctx, SHEET_FONT_BODY, isnan (line->max_u) ? "—" : lamina_format_fixed (max, line->max_u, 3),
                   c.x_max, *y, 0, PANGO_ALIGN_RIGHT);
  sheet_text_line (ctx, line->verdict == LAMINA_VERDICT_NOT_MET ? SHEET_FONT_BOLD : SHEET_FONT_BODY,
                   verdict_label (line->verdict), c.x_met, *y, c.x_area - c.x_met - 34, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_BODY, isnan (line->entry->area) ? "—"
                   : lamina_format_fixed (area, line->entry->area, 1), c.x_area, *y, 0, PANGO_ALIGN_RIGHT);
  sheet_text_line (ctx, SHEET_FONT_BODY, isnan (line->ua) ? "—" : lamina_format_fixed (ua, line->ua, 2),
                   c.x_ua, *y, 0, PANGO_ALIGN_RIGHT);
  *y += ROW;
  if (moisture != NULL)
    {
      sheet_text_line (ctx, SHEET_FONT_SMALL, moisture, c.x_code, *y - 3, ctx->right - c.x_code, PANGO_ALIGN_LEFT);
      *y += NOTE_ROW;
    }
  set_grey (ctx);
  for (guint i = 0; i < line->notes->len; i++)
    {
      g_autofree char *note = g_strdup_printf ("! %s", (const char *) line->notes->pdata[i]);

      sheet_text_line (ctx, SHEET_FONT_SMALL, note, c.x_code, *y - 3, ctx->right - c.x_code, PANGO_ALIGN_LEFT);
      *y += NOTE_ROW;
    }
  set_black (ctx);
  sheet_rule (ctx, *y - 3, 0.25, 0.75);
}

static double
draw_total_line (SheetContext *ctx,
                 const char   *label,
                 const char   *value,
                 SheetFont     font,
                 double        y)
{
  const Columns c = get_columns (ctx);

  sheet_text_line (ctx, font, label, c.x_name, y, c.x_area - c.x_name, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, font, value, c.x_ua, y, 0, PANGO_ALIGN_RIGHT);
  return y + ROW;
}

static void
draw_totals (SheetContext      *ctx,
             const SheetJobSet *set,
             double             y)
{
  const LaminaJobCheck *check = set->check;
  const Columns c = get_columns (ctx);
  char a[LAMINA_FORMAT_SIZE], h[LAMINA_FORMAT_SIZE], v[LAMINA_FORMAT_SIZE];
  g_autofree char *label = g_strdup_printf (_("H_T = Σ U·A over %s m² — the fabric of the listed elements only"),
                                            lamina_format_fixed (a, check->area, 1));

  y += 6;
  sheet_rule (ctx, y - 3, 0.6, 0);
  y = draw_total_line (ctx, label, lamina_format_fixed (h, check->h_t, 2), SHEET_FONT_BOLD, y);
  for (guint k = 0; k < LAMINA_N_ELEMENTS; k++)
    {
      g_autofree char *text = NULL;

      if (!(check->kinds[k].area > 0))
        continue;
      text = g_strdup_printf (_("%s: area-weighted mean U %s W/(m²·K) over %s m²"),
                              sheet_element_label ((LaminaElement) k),
                              lamina_format_fixed (v, check->kinds[k].mean_u, 3),
                              lamina_format_fixed (a, check->kinds[k].area, 1));
      sheet_text_line (ctx, SHEET_FONT_BODY, text, c.x_name, y, c.x_area - c.x_name, PANGO_ALIGN_LEFT);
      y += ROW;
    }
  if (set->job->junctions->len > 0)
    {
      y += 4;
      sheet_text_line (ctx, SHEET_FONT_LABEL, _("LINEAR THERMAL BRIDGES ENTERED BY HAND (ψ·l)"), c.x_name, y, 0,
                       PANGO_ALIGN_LEFT);
      y += 10;
      for (guint i = 0; i < set->job->junctions->len; i++)
        {
          const LaminaJobJunction *j = set->job->junctions->pdata[i];
          char p[LAMINA_FORMAT_SIZE], l[LAMINA_FORMAT_SIZE];
          g_autofree char *text = g_strdup_printf (_("%s: ψ %s W/(m·K) × %s m"), j->name,
                                                   lamina_format_fixed (p, j->psi, 3),
                                                   lamina_format_fixed (l, j->length, 1));

          y = draw_total_line (ctx, text, lamina_format_fixed (h, j->psi * j->length, 2), SHEET_FONT_BODY, y);
        }
      y = draw_total_line (ctx, _("H_T with the junctions entered"),
                           lamina_format_fixed (h, check->h_total, 2), SHEET_FONT_BOLD, y);
    }
  set_grey (ctx);
  sheet_text (ctx, SHEET_FONT_SMALL,
              _("U is each construction's corrected U (EN ISO 6946:2017, with the Annex F corrections) at "
                "the pinned revision; for a floor that states its ground, its U with the ground (EN ISO "
                "13370:2017) at the job's B′. H_T does not include thermal bridges other than those entered "
                "above, ventilation or other elements."),
              c.x_name, y + 4, ctx->right - c.x_name, PANGO_ALIGN_LEFT);
  set_black (ctx);
}

void
sheet_job_draw_front (SheetContext      *ctx,
                      const SheetJobSet *set,
                      guint              first_sheet_page)
{
  guint first = 0;
  gboolean totals_fit = FALSE;
  gboolean first_page = TRUE;

  ctx->page = 1;
  cairo_pdf_surface_add_outline (cairo_get_target (ctx->cr), CAIRO_PDF_OUTLINE_ROOT, _("Cover"),
                                 "page=1", 0);
  cairo_pdf_surface_add_outline (cairo_get_target (ctx->cr), CAIRO_PDF_OUTLINE_ROOT, _("Schedule"),
                                 "page=2", 0);
  draw_cover (ctx, set);
  cairo_show_page (ctx->cr);
  do
    {
      guint rows = count_rows (ctx, set, first, &totals_fit);
      double y = ctx->top;

      ctx->page++;
      sheet_draw_frame (ctx, FALSE);
      draw_schedule_head (ctx, set, first_page, &y);
      for (guint i = first; i < first + rows; i++)
        draw_row (ctx, set->check->lines->pdata[i], &y);
      first += rows;
      first_page = FALSE;
      if (first >= set->check->lines->len && totals_fit)
        draw_totals (ctx, set, y);
      draw_cautions (ctx);
      sheet_draw_footer (ctx);
      cairo_show_page (ctx->cr);
    }
  while (first < set->check->lines->len);
  if (!totals_fit)
    {
      double y = ctx->top;

      ctx->page++;
      sheet_draw_frame (ctx, FALSE);
      draw_schedule_head (ctx, set, FALSE, &y);
      draw_totals (ctx, set, y);
      draw_cautions (ctx);
      sheet_draw_footer (ctx);
      cairo_show_page (ctx->cr);
    }
  g_assert (ctx->page + 1 == first_sheet_page);
}

/* Writes @lines (LaminaJobLine* with a construction) of @job: with
 * @targets and @check, the cover and the schedule first (@check NULL:
 * the sheets alone). */
static gboolean
write_job_sheets (const char               *path,
                  gboolean                  overwrite,
                  const LaminaSheetOptions *options,
                  const LaminaJob          *job,
                  const LaminaTargetSet    *targets,
                  const LaminaJobCheck     *check,
                  GPtrArray                *lines,
                  LaminaSheetProgress       progress,
                  LaminaSheetContinue       keep_going,
                  gpointer                  data,
                  GError                  **error)
{
  SheetJobSet set = { job, targets, check, lines, { 0 }, *options, check != NULL, keep_going, data };

  set.band = (LaminaSheetJob) { job->name, job->number, job->client, NULL };
  set.options.job = &set.band;
  if (check != NULL)
    set.options.title = job->name;
  return sheet_write_job_document (path, overwrite, &set, progress, data, error);
}

gboolean
lamina_sheet_write_job (const char               *path,
                        gboolean                  overwrite,
                        const LaminaSheetOptions *options,
                        const LaminaJob          *job,
                        const LaminaTargetSet    *targets,
                        const LaminaJobCheck     *check,
                        GError                  **error)
{
  return lamina_sheet_write_job_full (path, overwrite, options, job, targets, check,
                                      NULL, NULL, NULL, error);
}

gboolean
lamina_sheet_write_job_full (const char               *path,
                             gboolean                  overwrite,
                             const LaminaSheetOptions *options,
                             const LaminaJob          *job,
                             const LaminaTargetSet    *targets,
                             const LaminaJobCheck     *check,
                             LaminaSheetProgress       progress,
                             LaminaSheetContinue       keep_going,
                             gpointer                  data,
                             GError                  **error)
{
  g_autoptr(GPtrArray) lines = g_ptr_array_new ();

  g_return_val_if_fail (path != NULL && options != NULL && job != NULL && check != NULL, FALSE);

  for (guint i = 0; i < check->lines->len; i++)
    if (((const LaminaJobLine *) check->lines->pdata[i])->construction != NULL)
      g_ptr_array_add (lines, check->lines->pdata[i]);
  return write_job_sheets (path, overwrite, options, job, targets, check, lines,
                           progress, keep_going, data, error);
}

gboolean
lamina_sheet_write_job_entry (const char               *path,
                              gboolean                  overwrite,
                              const LaminaSheetOptions *options,
                              const LaminaJob          *job,
                              const LaminaJobLine      *line,
                              GError                  **error)
{
  g_autoptr(GPtrArray) lines = g_ptr_array_new ();

  g_return_val_if_fail (path != NULL && options != NULL && job != NULL && line != NULL, FALSE);
  g_return_val_if_fail (line->construction != NULL, FALSE);

  g_ptr_array_add (lines, (gpointer) line);
  return write_job_sheets (path, overwrite, options, job, NULL, NULL, lines, NULL, NULL, NULL, error);
}
