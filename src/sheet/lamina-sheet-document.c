/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sheet-document.c: the PDF file: pages streamed one at a time,
 * bookmarks, metadata, and the atomic write. */
#define G_LOG_DOMAIN "lamina-sheet"

#include "config.h"

#include "lamina-sheet-private.h"
#include "lamina-cairo-output.h"

#include <cairo-pdf.h>
#include <glib/gi18n-lib.h>
#include <math.h>

static char *
dup_iso_date (const char *printed)
{
  /* PDF metadata wants ISO 8601; the printed date is YYYY-MM-DD. */
  return g_strdup_printf ("%sT00:00:00Z", printed);
}

static void
set_metadata (cairo_surface_t          *surface,
              const SheetContext       *ctx,
              const char               *title)
{
  g_autofree char *creator = g_strdup_printf ("Lamina %s", PACKAGE_VERSION);
  g_autofree char *date = dup_iso_date (ctx->printed);

  cairo_pdf_surface_set_metadata (surface, CAIRO_PDF_METADATA_TITLE, title);
  if (ctx->options->practice)
    cairo_pdf_surface_set_metadata (surface, CAIRO_PDF_METADATA_AUTHOR, ctx->options->practice);
  cairo_pdf_surface_set_metadata (surface, CAIRO_PDF_METADATA_SUBJECT,
                                  _("Construction specification sheets, EN ISO 6946:2017"));
  cairo_pdf_surface_set_metadata (surface, CAIRO_PDF_METADATA_KEYWORDS,
                                  "U-value; thermal transmittance; EN ISO 6946");
  cairo_pdf_surface_set_metadata (surface, CAIRO_PDF_METADATA_CREATOR, creator);
  cairo_pdf_surface_set_metadata (surface, CAIRO_PDF_METADATA_CREATE_DATE, date);
}

static LaminaResult *
calculate (const LaminaConstruction *c,
           GError                  **error)
{
  g_autoptr(GError) local = NULL;
  LaminaResult *result = lamina_calculate (c, &local);

  if (result == NULL)
    g_set_error (error, LAMINA_SHEET_ERROR, LAMINA_SHEET_ERROR_INVALID, "%s: %s",
                 c->code ? c->code : c->id, local->message);
  return result;
}

/* A construction with a moisture check (EN ISO 13788) and the climate
 * data it was made with continues on a page of its own. */
static guint
count_extra_pages (const LaminaConstruction *c)
{
  return c->moisture != NULL && c->moisture->climate_data != NULL ? 1 : 0;
}

static LaminaMoistureResult *
dup_moisture (const LaminaConstruction *c,
              const LaminaSheetOptions *options,
              GError                  **error)
{
  double limit = options->moisture_limit;

  return lamina_moisture_calculate_own (c, LAMINA_MOISTURE_LIMIT_IS_VALID (limit) ? limit : NAN, error);
}

/* The pages of a construction's sheet: its own (more than one when its
 * text goes on over a continuation page) and the moisture page. */
static gboolean
count_pages (const LaminaSheetOptions *options,
             const LaminaConstruction *c,
             const LaminaResult       *r,
             const LaminaFieldResult  *field,
             const LaminaJobLine      *job_line,
             guint                    *pages,
             GError                  **error)
{
  g_autoptr(LaminaMoistureResult) moisture = NULL;

  if (count_extra_pages (c) > 0 && (moisture = dup_moisture (c, options, error)) == NULL)
    return FALSE;
  *pages = sheet_count_pages (options, c, r, field, moisture, job_line) + count_extra_pages (c);
  return TRUE;
}

static void
clear_entry (gpointer data)
{
  SheetIndexEntry *e = data;

  g_free (e->code);
  g_free (e->name);
}

/* First pass: the index rows, one construction at a time. */
static GArray *
collect_index (const LaminaSheetOptions *options,
               guint                     n,
               LaminaSheetFetch          fetch,
               gpointer                  fetch_data,
               GError                  **error)
{
  g_autoptr(GArray) entries = g_array_sized_new (FALSE, TRUE, sizeof (SheetIndexEntry), n);

  g_array_set_clear_func (entries, clear_entry);
  for (guint i = 0; i < n; i++)
    {
      g_autoptr(LaminaConstruction) c = fetch (fetch_data, i, error);
      g_autoptr(LaminaResult) r = NULL;
      SheetIndexEntry e;
      guint pages;

      if (c == NULL || (r = calculate (c, error)) == NULL
          || !count_pages (options, c, r, NULL, NULL, &pages, error))
        return NULL;
      e.code = g_strdup (c->code ? c->code : c->id);
      e.name = g_strdup (c->name);
      e.element = c->element;
      e.status = c->status;
      e.u = r->u_corrected;
      e.thickness = r->thickness;
      e.extra_pages = pages - 1;
      e.page = 0;
      g_array_append_val (entries, e);
    }
  return g_steal_pointer (&entries);
}

static void
add_sheet_outline (cairo_surface_t          *surface,
                   int                      *parents,
                   const LaminaConstruction *c,
                   const char               *dest)
{
  g_autofree char *label = g_strdup_printf ("%s  %s", c->code ? c->code : c->id, c->name);

  if (parents[c->element] == 0)
    parents[c->element] = cairo_pdf_surface_add_outline (surface, CAIRO_PDF_OUTLINE_ROOT,
                                                         sheet_element_label (c->element), dest,
                                                         CAIRO_PDF_OUTLINE_FLAG_OPEN);
  cairo_pdf_surface_add_outline (surface, parents[c->element], label, dest, 0);
}

typedef struct
{
  guint             n;
  LaminaSheetFetch  fetch;
  gpointer          fetch_data;
  gboolean          front_matter;
  LaminaFileWriter *writer;       /* stop early once a write failed */
  /* A page of its own (a comparison) instead of sheets: */
  SheetPaintFunc    paint;
  gpointer          paint_data;
  const char       *title;
  const SheetJobSet *job_set;     /* a job's cover and schedule before the sheets */
} Source;

static gboolean
write_pages (cairo_surface_t          *surface,
             cairo_t                  *cr,
             const LaminaSheetOptions *options,
             const Source             *source,
             LaminaSheetProgress       progress,
             gpointer                  progress_data,
             GError                  **error)
{
  SheetContext ctx;
  g_autoptr(GArray) entries = NULL;
  int parents[LAMINA_N_ELEMENTS] = { 0 };
  guint index_pages = 0, first_sheet, extra_pages = 0, page;
  gboolean ok = TRUE;

  sheet_context_init (&ctx, cr, options);
  if (source->paint != NULL)
    {
      set_metadata (surface, &ctx, source->title);
      ok = source->paint (&ctx, source->paint_data, error);
      cairo_show_page (cr);
      sheet_context_clear (&ctx);
      return ok;
    }
  if (source->front_matter)
    {
      guint left;

      entries = collect_index (options, source->n, source->fetch, source->fetch_data, error);
      if (entries == NULL)
        {
          sheet_context_clear (&ctx);
          return FALSE;
        }
      left = source->n;
      for (gboolean first = TRUE; left > 0 || first; first = FALSE)
        {
          guint rows = sheet_index_rows_per_page (&ctx, first);
          left -= MIN (left, rows);
          index_pages++;
        }
    }
  first_sheet = source->front_matter ? 2 + index_pages : 1;
  if (source->job_set != NULL && source->job_set->front)
    first_sheet = 1 + sheet_job_count_front (&ctx, source->job_set);
  /* Every page is numbered "n of N" as it is written, so the moisture
   * pages are counted first: from the index rows of a catalogue, else by
   * fetching the sheets (a single sheet or a job's, held in memory). */
  for (guint i = 0; i < source->n; i++)
    {
      if (entries != NULL)
        {
          SheetIndexEntry *e = &g_array_index (entries, SheetIndexEntry, i);

          e->page = first_sheet + i + extra_pages;
          extra_pages += e->extra_pages;
        }
      else
        {
          g_autoptr(LaminaConstruction) c = source->fetch (source->fetch_data, i, error);
          g_autoptr(LaminaResult) r = NULL;
          const LaminaJobLine *line = source->job_set != NULL ? source->job_set->sheets->pdata[i] : NULL;
          guint pages;

          if (c == NULL || (r = calculate (c, error)) == NULL
              || !count_pages (options, c, r, NULL, line, &pages, error))
            {
              sheet_context_clear (&ctx);
              return FALSE;
            }
          extra_pages += pages - 1;
        }
    }
  ctx.n_pages = first_sheet - 1 + source->n + extra_pages;
  if (source->job_set != NULL && source->job_set->front)
    {
      set_metadata (surface, &ctx, source->job_set->job->name);
      sheet_job_draw_front (&ctx, source->job_set, first_sheet);
    }

  if (source->front_matter)
    {
      ctx.page = 1;
      set_metadata (surface, &ctx, options->title ? options->title : _("Construction catalogue"));
      cairo_pdf_surface_add_outline (surface, CAIRO_PDF_OUTLINE_ROOT, _("Cover"), "page=1", 0);
      cairo_pdf_surface_add_outline (surface, CAIRO_PDF_OUTLINE_ROOT, _("Index"), "page=2", 0);
      sheet_draw_cover (&ctx, source->n);
      cairo_show_page (cr);
      for (guint first = 0, p = 0; p < index_pages; p++)
        {
          ctx.page = 2 + p;
          first += sheet_draw_index (&ctx, (SheetIndexEntry *) (void *) entries->data,
                                     entries->len, first, first_sheet);
          cairo_show_page (cr);
        }
    }

  page = first_sheet;
  for (guint i = 0; i < source->n && ok && !lamina_file_writer_failed (source->writer); i++)
    {
      g_autoptr(LaminaConstruction) c = source->fetch (source->fetch_data, i, error);
      g_autoptr(LaminaResult) r = NULL;
      g_autoptr(LaminaFieldResult) field = NULL;
      g_autoptr(LaminaMoistureResult) moisture = NULL;
      /* Named destinations: cairo 1.16 drops a "page=" link to a page
       * that is not written yet. */
      g_autofree char *dest = g_strdup_printf ("dest='sheet-%u'", i + 1);
      g_autofree char *name = g_strdup_printf ("name='sheet-%u'", i + 1);

      if (c == NULL || (r = calculate (c, error)) == NULL)
        {
          ok = FALSE;
          break;
        }
      if (!source->front_matter && (source->job_set == NULL || !source->job_set->front))
        set_metadata (surface, &ctx, c->name);
      if (source->job_set != NULL)
        ctx.job_line = source->job_set->sheets->pdata[i];
      ctx.page = page;
      add_sheet_outline (surface, parents, c, dest);
      ctx.dest = name;
      /* A single sheet outside EN ISO 6946 continues with its 2-D check
       * (a catalogue's index counts one page per sheet). */
      if (!source->front_matter && options->field_check && lamina_field_is_advised (r))
        {
          field = lamina_field_calculate (c, 0, NULL, NULL, error);
          if (field == NULL)
            {
              ok = FALSE;
              break;
            }
          ctx.n_pages++;
          ctx.field = field;
        }
      /* A construction with a moisture check (EN ISO 13788): its summary on
       * the first page and a page of its own (counted above), with the
       * office's limit. */
      if (count_extra_pages (c) > 0)
        {
          moisture = dup_moisture (c, options, error);
          if (moisture == NULL)
            {
              ok = FALSE;
              break;
            }
          ctx.moisture = moisture;
          ctx.moisture_page = TRUE;
        }
      /* The 2-D check's summary was not on the sheet when the pages were
       * counted: a single sheet's count follows what it adds. */
      if (field != NULL)
        ctx.n_pages += sheet_count_pages (options, c, r, field, moisture, ctx.job_line)
                       - sheet_count_pages (options, c, r, NULL, moisture, ctx.job_line);
      sheet_draw_page (&ctx, c, r);
      ctx.dest = NULL;
      cairo_show_page (cr);
      if (field != NULL)
        {
          ctx.page++;
          sheet_draw_field_page (&ctx, c, field);
          cairo_show_page (cr);
          ctx.field = NULL;
          g_clear_pointer (&field, lamina_field_result_free);
        }
      if (moisture != NULL && ctx.moisture_page)
        {
          ctx.page++;
          sheet_draw_moisture_page (&ctx, c, moisture);
          cairo_show_page (cr);
        }
      ctx.moisture = NULL;
      ctx.moisture_page = FALSE;
      page = ctx.page + 1;
      if (progress)
        progress (progress_data, i + 1, source->n);
    }
  sheet_context_clear (&ctx);
  return ok;
}

static gboolean
write_document (const char               *path,
                gboolean                  overwrite,
                const LaminaSheetOptions *options,
                const Source             *source,
                LaminaSheetProgress       progress,
                gpointer                  progress_data,
                GError                  **error)
{
  LaminaFileWriter *writer = lamina_cairo_output_open (path, overwrite, error);
  Source output_source = *source;
  cairo_surface_t *surface;
  cairo_status_t status;
  double width, height;
  gboolean ok;
  cairo_t *cr;

  if (writer == NULL)
    return FALSE;
  lamina_paper_get_size (options->paper, &width, &height);
  surface = cairo_pdf_surface_create_for_stream (lamina_cairo_output_write_cb, writer, width, height);
  cr = cairo_create (surface);
  output_source.writer = writer;
  ok = write_pages (surface, cr, options, &output_source, progress, progress_data, error);
  cairo_destroy (cr);
  /* cairo reports a failed write only here, after the trailer. */
  cairo_surface_finish (surface);
  status = cairo_surface_status (surface);
  cairo_surface_destroy (surface);
  return lamina_cairo_output_close (writer, ok, status, error);
}

static LaminaConstruction *
fetch_single_cb (gpointer   user_data,
                 guint      index,
                 GError   **error)
{
  return lamina_construction_copy (user_data);
}

gboolean
lamina_sheet_write_pdf (const char               *path,
                        gboolean                  overwrite,
                        const LaminaSheetOptions *options,
                        const LaminaConstruction *construction,
                        GError                  **error)
{
  Source source = { 1, fetch_single_cb, (gpointer) construction, FALSE, NULL, NULL, NULL, NULL, NULL };

  g_return_val_if_fail (path != NULL && options != NULL && construction != NULL, FALSE);
  return write_document (path, overwrite, options, &source, NULL, NULL, error);
}

gboolean
lamina_sheet_write_catalogue (const char               *path,
                              gboolean                  overwrite,
                              const LaminaSheetOptions *options,
                              guint                     n,
                              LaminaSheetFetch          fetch,
                              gpointer                  fetch_data,
                              LaminaSheetProgress       progress,
                              gpointer                  progress_data,
                              GError                  **error)
{
  Source source = { n, fetch, fetch_data, TRUE, NULL, NULL, NULL, NULL, NULL };

  g_return_val_if_fail (path != NULL && options != NULL && fetch != NULL, FALSE);
  return write_document (path, overwrite, options, &source, progress, progress_data, error);
}

gboolean
sheet_write_single_page (const char               *path,
                         gboolean                  overwrite,
                         const LaminaSheetOptions *options,
                         const char               *title,
                         SheetPaintFunc            paint,
                         gpointer                  paint_data,
                         GError                  **error)
{
  Source source = { 0, NULL, NULL, FALSE, NULL, paint, paint_data, title, NULL };

  return write_document (path, overwrite, options, &source, NULL, NULL, error);
}

static LaminaConstruction *
fetch_job_sheet_cb (gpointer   user_data,
                    guint      index,
                    GError   **error)
{
  const SheetJobSet *set = user_data;
  const LaminaJobLine *line = set->sheets->pdata[index];
  LaminaConstruction *c;

  /* Stopped here, nothing is written (the writer drops its temporary). */
  if (set->keep_going != NULL && !set->keep_going (set->keep_going_data, error))
    return NULL;
  c = lamina_construction_copy (line->construction);
  /* The sheet compares U with the job's target for the entry's use. */
  c->target_u = line->max_u;
  return c;
}

gboolean
sheet_write_job_document (const char          *path,
                          gboolean             overwrite,
                          const SheetJobSet   *set,
                          LaminaSheetProgress  progress,
                          gpointer             progress_data,
                          GError             **error)
{
  Source source = { set->sheets->len, fetch_job_sheet_cb, (gpointer) set, FALSE, NULL,
                    NULL, NULL, NULL, set };

  return write_document (path, overwrite, &set->options, &source, progress, progress_data, error);
}
