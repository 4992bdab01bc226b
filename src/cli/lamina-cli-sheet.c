/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli section | sheet | catalogue: drawings and PDF sheets, from
 * the office library or straight from a catalogue document (--from). */
#define G_LOG_DOMAIN "lamina-cli"

#include "config.h"

#include "lamina-cli.h"
#include "lamina-cli-library.h"
#include "lamina-catalogue.h"
#include "lamina-file.h"
#include "lamina-design.h"
#include "lamina-library.h"
#include "lamina-section.h"
#include "lamina-sheet.h"

#include <glib/gi18n.h>
#include <math.h>
#include <stdio.h>
#include <string.h>
#include <unistd.h>

typedef struct
{
  char            *from;      /* --from FILE.xml */
  char            *output;    /* -o */
  char            *practice;
  char            *title;
  char            *paper;
  char            *search;
  char            *status;
  int              width, height;
  /* the source */
  LaminaCatalogue *catalogue;
  LaminaLibrary   *library;
  GPtrArray       *ids;       /* char*: ids in the library, or in the document */
  char            *revision_text; /* sheet --revision N */
  GArray          *revisions; /* int per id: the library revision, 0 = latest */
} Job;

static void
job_clear (Job *job)
{
  g_free (job->from);
  g_free (job->output);
  g_free (job->practice);
  g_free (job->title);
  g_free (job->paper);
  g_free (job->search);
  g_free (job->status);
  g_clear_pointer (&job->catalogue, lamina_catalogue_free);
  g_clear_object (&job->library);
  g_clear_pointer (&job->ids, g_ptr_array_unref);
  g_free (job->revision_text);
  g_clear_pointer (&job->revisions, g_array_unref);
}

G_DEFINE_AUTO_CLEANUP_CLEAR_FUNC (Job, job_clear)

static gboolean
open_source (Job                    *job,
             const LaminaCliGlobals *globals)
{
  g_autoptr(GError) error = NULL;

  if (job->from)
    {
      job->catalogue = lamina_catalogue_read_file (job->from, &error);
      if (job->catalogue == NULL)
        {
          lamina_cli_error ("%s", error->message);
          return FALSE;
        }
      return TRUE;
    }
  job->library = lamina_cli_open_library (globals, FALSE);
  return job->library != NULL;
}

/* An id or office code, looked up in the document or the library. */
static char *
resolve (Job        *job,
         const char *key)
{
  if (job->library)
    return lamina_cli_resolve_id (job->library, key);
  for (guint i = 0; i < job->catalogue->constructions->len; i++)
    {
      LaminaConstruction *c = job->catalogue->constructions->pdata[i];
      if (g_strcmp0 (c->id, key) == 0 || g_strcmp0 (c->code, key) == 0)
        return g_strdup (c->id);
    }
  lamina_cli_error (_("%s: no construction with id or code “%s”"), job->from, key);
  return NULL;
}

static LaminaConstruction *
fetch_cb (gpointer   user_data,
          guint      index,
          GError   **error)
{
  Job *job = user_data;
  const char *id = job->ids->pdata[index];
  int revision = job->revisions && index < job->revisions->len ? g_array_index (job->revisions, int, index) : 0;

  if (job->library)
    return lamina_library_dup_construction (job->library, id, revision, error);
  return lamina_construction_copy (lamina_catalogue_find (job->catalogue, id));
}

static void
progress_cb (gpointer user_data,
             guint    done,
             guint    total)
{
  fprintf (stderr, "\r%s", "");
  fprintf (stderr, _("Sheets: %u of %u"), done, total);
  if (done == total)
    fputc ('\n', stderr);
}

static gboolean
fill_options (const Job          *job,
              LaminaSheetOptions *options)
{
  lamina_sheet_options_init (options);
  if (job->paper && !lamina_paper_from_string (job->paper, &options->paper))
    {
      lamina_cli_error (_("--paper: unknown paper “%s” (a4, a3 or letter)"), job->paper);
      return FALSE;
    }
  options->practice = job->practice ? job->practice : job->catalogue ? job->catalogue->title : NULL;
  options->title = job->title;
  /* A catalogue file is checked with the default limit, a library's
   * constructions with the office's. */
  options->moisture_limit = job->library ? lamina_library_get_moisture_limit (job->library) : NAN;
  return TRUE;
}

static gboolean
check_output (const Job              *job,
              const LaminaCliGlobals *globals)
{
  g_autoptr(GError) error = NULL;

  if (job->output == NULL)
    {
      lamina_cli_error (_("-o FILE is required"));
      return FALSE;
    }
  if (!lamina_file_check_target (job->output, globals->force, &error))
    {
      lamina_cli_error ("%s", error->message);
      return FALSE;
    }
  return TRUE;
}

static GOptionContext *
create_context (Job        *job,
                const char *parameter,
                gboolean    pdf,
                gboolean    selection)
{
  GOptionEntry common[] = {
    { "output", 'o', 0, G_OPTION_ARG_FILENAME, &job->output, N_("Write to FILE (“-”: standard output)"), "FILE" },
    { "from", 0, 0, G_OPTION_ARG_FILENAME, &job->from, N_("Read the constructions from a catalogue document"), "FILE.xml" },
    { NULL }
  };
  GOptionEntry sheet[] = {
    { "practice", 0, 0, G_OPTION_ARG_STRING, &job->practice, N_("Practice name in the header"), "NAME" },
    { "paper", 0, 0, G_OPTION_ARG_STRING, &job->paper, N_("Paper size: a4, a3 or letter"), "SIZE" },
    { NULL }
  };
  GOptionEntry choose[] = {
    { "title", 0, 0, G_OPTION_ARG_STRING, &job->title, N_("Title on the cover"), "TEXT" },
    { "search", 0, 0, G_OPTION_ARG_STRING, &job->search, N_("Only constructions matching TEXT"), "TEXT" },
    { "status", 0, 0, G_OPTION_ARG_STRING, &job->status, N_("Only constructions with this review status"), "STATUS" },
    { NULL }
  };
  GOptionEntry one[] = {
    { "revision", 0, 0, G_OPTION_ARG_STRING, &job->revision_text,
      N_("Revision N of a library construction (default: the latest)"), "N" },
    { NULL }
  };
  GOptionEntry png[] = {
    { "width", 0, 0, G_OPTION_ARG_INT, &job->width, N_("Image width in pixels (default 1600)"), "PX" },
    { "height", 0, 0, G_OPTION_ARG_INT, &job->height, N_("Image height in pixels (default 1000)"), "PX" },
    { NULL }
  };
  GOptionContext *context = g_option_context_new (parameter);

  g_option_context_set_translation_domain (context, GETTEXT_PACKAGE);
  g_option_context_add_main_entries (context, common, GETTEXT_PACKAGE);
  g_option_context_add_main_entries (context, pdf ? sheet : png, GETTEXT_PACKAGE);
  if (selection)
    g_option_context_add_main_entries (context, choose, GETTEXT_PACKAGE);
  else if (pdf)
    g_option_context_add_main_entries (context, one, GETTEXT_PACKAGE);
  return context;
}

/* section ID -o FILE.png|FILE.svg [--from FILE.xml] [--width PX] [--height PX] */
int
lamina_cli_section (const LaminaCliGlobals *globals,
                    int                     argc,
                    char                  **argv)
{
  g_auto(Job) job = { .width = 1600, .height = 1000 };
  g_autoptr(GOptionContext) context = create_context (&job, _("ID"), FALSE, FALSE);
  g_autoptr(LaminaConstruction) c = NULL;
  g_autoptr(LaminaResult) result = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *id = NULL;
  gboolean svg;

  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (job.width < 100 || job.width > 20000 || job.height < 100 || job.height > 20000)
    {
      gboolean w = job.width < 100 || job.width > 20000;

      lamina_cli_error (_("--%s: %d px is outside the allowed range 100 to 20000 px"),
                        w ? "width" : "height", w ? job.width : job.height);
      return LAMINA_EXIT_USAGE;
    }
  if (argc != 2)
    {
      lamina_cli_error (_("usage: section ID -o FILE.png or FILE.svg"));
      return LAMINA_EXIT_USAGE;
    }
  if (!check_output (&job, globals))
    return job.output ? LAMINA_EXIT_BAD_INPUT : LAMINA_EXIT_USAGE;
  if (!open_source (&job, globals) || (id = resolve (&job, argv[1])) == NULL)
    return LAMINA_EXIT_BAD_INPUT;
  job.ids = g_ptr_array_new_with_free_func (g_free);
  g_ptr_array_add (job.ids, g_strdup (id));
  c = fetch_cb (&job, 0, &error);
  if (c != NULL)
    result = lamina_calculate (c, &error);
  if (result == NULL)
    {
      lamina_cli_error ("%s: %s", argv[1], error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  svg = g_str_has_suffix (job.output, ".svg") || g_str_has_suffix (job.output, ".SVG");
  if (!(svg ? lamina_section_write_svg : lamina_section_write_png) (c, result, job.width, job.height, job.output,
                                                                    globals->force, &error))
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  /* TRANSLATORS: "EW-101 revision 3: section drawn to ew-101.svg (SVG, 1600 × 1000 px)" */
  fprintf (lamina_cli_message_stream (job.output), _("%s revision %d: section drawn to %s (%s, %d × %d px)\n"), c->code ? c->code : c->id, c->revision,
          job.output, svg ? "SVG" : "PNG", job.width, job.height);
  return LAMINA_EXIT_OK;
}

/* sheet ID -o FILE.pdf [--from FILE.xml] [--practice NAME] [--paper SIZE] */
int
lamina_cli_sheet (const LaminaCliGlobals *globals,
                  int                     argc,
                  char                  **argv)
{
  g_auto(Job) job = { 0 };
  g_autoptr(GOptionContext) context = create_context (&job, _("ID"), TRUE, FALSE);
  g_autoptr(LaminaConstruction) c = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *id = NULL;
  LaminaSheetOptions options;

  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (argc != 2)
    {
      lamina_cli_error (_("usage: sheet ID -o FILE.pdf"));
      return LAMINA_EXIT_USAGE;
    }
  if (!check_output (&job, globals))
    return job.output ? LAMINA_EXIT_BAD_INPUT : LAMINA_EXIT_USAGE;
  if (!open_source (&job, globals) || (id = resolve (&job, argv[1])) == NULL)
    return LAMINA_EXIT_BAD_INPUT;
  if (!fill_options (&job, &options))
    return LAMINA_EXIT_USAGE;
  job.ids = g_ptr_array_new_with_free_func (g_free);
  g_ptr_array_add (job.ids, g_strdup (id));
  /* --revision N: an approved revision stays printable while a draft
   * follows it. */
  if (job.revision_text != NULL)
    {
      int revision = 0;

      if (!lamina_cli_parse_revision (job.revision_text, &revision))
        return LAMINA_EXIT_USAGE;
      if (job.library == NULL)
        {
          lamina_cli_error (_("--revision: only for a construction of the library"));
          return LAMINA_EXIT_USAGE;
        }
      job.revisions = g_array_new (FALSE, FALSE, sizeof (int));
      g_array_append_val (job.revisions, revision);
    }
  c = fetch_cb (&job, 0, &error);
  /* A revision with a stored 2-D check (lamina-cli field) reports it. */
  if (c != NULL && job.library != NULL && lamina_library_has_field_check (job.library, c->id, c->revision))
    options.field_check = TRUE;
  if (c == NULL || !lamina_sheet_write_pdf (job.output, globals->force, &options, c, &error))
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  /* TRANSLATORS: "EW-101 revision 3 (approved): sheet written to ew-101.pdf" */
  fprintf (lamina_cli_message_stream (job.output), _("%s revision %d (%s): sheet written to %s\n"), c->code ? c->code : c->id, c->revision,
          lamina_status_to_string (c->status), job.output);
  return LAMINA_EXIT_OK;
}

static gboolean
select_ids (Job   *job,
            int    argc,
            char **argv)
{
  LaminaStatus status = LAMINA_STATUS_DRAFT;

  job->ids = g_ptr_array_new_with_free_func (g_free);
  if (job->status && !lamina_cli_parse_status (job->status, &status))
    return FALSE;
  for (int i = 1; i < argc; i++)
    {
      char *id = resolve (job, argv[i]);
      if (id == NULL)
        return FALSE;
      g_ptr_array_add (job->ids, id);
    }
  if (argc > 1)
    return TRUE;
  if (job->library)
    {
      g_autoptr(GError) error = NULL;
      g_autoptr(GPtrArray) rows = NULL;
      LaminaLibraryQuery q;

      lamina_library_query_init (&q);
      q.text = job->search;
      /* Approved: the latest approved revision of each construction, also
       * of one whose latest revision is a draft that follows it. */
      q.status = job->status && status != LAMINA_STATUS_APPROVED ? (int) status : -1;
      rows = lamina_library_search (job->library, &q, &error);
      if (rows == NULL)
        {
          lamina_cli_error ("%s", error->message);
          return FALSE;
        }
      if (job->status && status == LAMINA_STATUS_APPROVED)
        job->revisions = g_array_new (FALSE, FALSE, sizeof (int));
      for (guint i = 0; i < rows->len; i++)
        {
          const char *id = ((LaminaSummary *) rows->pdata[i])->id;

          if (job->revisions != NULL)
            {
              gboolean approved = FALSE;
              int revision = lamina_library_pick_revision (job->library, id, 0, &approved, NULL);

              if (revision <= 0 || !approved)
                continue;
              g_array_append_val (job->revisions, revision);
            }
          g_ptr_array_add (job->ids, g_strdup (id));
        }
      return TRUE;
    }
  for (guint i = 0; i < job->catalogue->constructions->len; i++)
    {
      LaminaConstruction *c = job->catalogue->constructions->pdata[i];
      g_autofree char *hay = g_utf8_casefold (c->name ? c->name : "", -1);
      g_autofree char *needle = job->search ? g_utf8_casefold (job->search, -1) : NULL;

      if (job->status && c->status != status)
        continue;
      if (needle && !strstr (hay, needle) && g_ascii_strcasecmp (c->code ? c->code : "", job->search) != 0)
        continue;
      g_ptr_array_add (job->ids, g_strdup (c->id));
    }
  return TRUE;
}

/* catalogue [ID…] [--search TEXT] [--status STATUS] -o FILE.pdf */
int
lamina_cli_catalogue (const LaminaCliGlobals *globals,
                      int                     argc,
                      char                  **argv)
{
  g_auto(Job) job = { 0 };
  g_autoptr(GOptionContext) context = create_context (&job, _("[ID…]"), TRUE, TRUE);
  g_autoptr(GError) error = NULL;
  LaminaSheetOptions options;

  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (!check_output (&job, globals))
    return job.output ? LAMINA_EXIT_BAD_INPUT : LAMINA_EXIT_USAGE;
  if (!open_source (&job, globals) || !select_ids (&job, argc, argv))
    return LAMINA_EXIT_BAD_INPUT;
  if (!fill_options (&job, &options))
    return LAMINA_EXIT_USAGE;
  if (job.ids->len == 0)
    {
      lamina_cli_error (_("no construction matches"));
      return LAMINA_EXIT_BAD_INPUT;
    }
  if (!lamina_sheet_write_catalogue (job.output, globals->force, &options, job.ids->len, fetch_cb, &job,
                                     isatty (STDERR_FILENO) ? progress_cb : NULL, NULL, &error))
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  fprintf (lamina_cli_message_stream (job.output), g_dngettext (GETTEXT_PACKAGE, "Catalogue of %u sheet written to %s\n",
                       "Catalogue of %u sheets written to %s\n", job.ids->len),
          job.ids->len, job.output);
  return LAMINA_EXIT_OK;
}

/* "ID" or "ID@N" (revision N of a library construction). */
static LaminaConstruction *
fetch_side (Job        *job,
            const char *arg,
            GError    **error)
{
  g_autofree char *key = g_strdup (arg);
  g_autofree char *id = NULL;
  char *at = strrchr (key, '@');
  int revision = 0;

  if (at != NULL && job->library != NULL)
    {
      *at = '\0';
      if (!lamina_cli_parse_revision (at + 1, &revision))
        return NULL;
    }
  if ((id = resolve (job, key)) == NULL)
    return NULL;
  if (job->library)
    return lamina_library_dup_construction (job->library, id, revision, error);
  return lamina_construction_copy (lamina_catalogue_find (job->catalogue, id));
}

static void
print_comparison (const LaminaConstruction *a,
                  const LaminaConstruction *b)
{
  g_autoptr(LaminaResult) ra = lamina_calculate (a, NULL);
  g_autoptr(LaminaResult) rb = lamina_calculate (b, NULL);
  g_autoptr(GPtrArray) rows = NULL;

  if (ra == NULL || rb == NULL)
    return;
  rows = lamina_comparison_rows (a, ra, b, rb);
  printf ("A  %s — %s\nB  %s — %s\n\n", a->code ? a->code : a->id, a->name, b->code ? b->code : b->id, b->name);
  printf ("  %36s %12s %12s %10s\n", "", "A", "B", "B-A");
  for (guint i = 0; i < rows->len; i++)
    {
      const LaminaComparisonRow *r = rows->pdata[i];
      /* printf pads by bytes; −, ≤ and ² are several. */
      int pl = 36 - (int) g_utf8_strlen (r->label, -1), pa = 12 - (int) g_utf8_strlen (r->a, -1);
      int pb = 12 - (int) g_utf8_strlen (r->b, -1), pd = 10 - (int) g_utf8_strlen (r->difference, -1);

      printf ("  %s%*s %*s%s %*s%s %*s%s  %s\n", r->label, MAX (pl, 0), "", MAX (pa, 0), "", r->a,
              MAX (pb, 0), "", r->b, MAX (pd, 0), "", r->difference, r->unit);
    }
  printf ("\n");
}

/* compare A B [-o FILE.pdf] [--from FILE.xml] [--practice NAME] [--paper SIZE]
 * A and B are ids or codes; ID@N is revision N of a library construction. */
int
lamina_cli_compare (const LaminaCliGlobals *globals,
                    int                     argc,
                    char                  **argv)
{
  g_auto(Job) job = { 0 };
  g_autoptr(GOptionContext) context = create_context (&job, _("A B — two build-ups side by side (ID or ID@REVISION)"),
                                                      TRUE, FALSE);
  g_autoptr(LaminaConstruction) a = NULL;
  g_autoptr(LaminaConstruction) b = NULL;
  g_autoptr(GError) error = NULL;
  LaminaSheetOptions options;

  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (argc != 3)
    {
      lamina_cli_error (_("usage: compare A B [-o FILE.pdf] (ids or codes; ID@N for revision N)"));
      return LAMINA_EXIT_USAGE;
    }
  if (job.output != NULL && !check_output (&job, globals))
    return LAMINA_EXIT_BAD_INPUT;
  if (!fill_options (&job, &options))
    return LAMINA_EXIT_USAGE;
  if (!open_source (&job, globals))
    return LAMINA_EXIT_BAD_INPUT;
  a = fetch_side (&job, argv[1], &error);
  if (a != NULL)
    b = fetch_side (&job, argv[2], &error);
  if (b == NULL)
    {
      if (error != NULL)
        lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  if (job.output == NULL)
    {
      print_comparison (a, b);
      return LAMINA_EXIT_OK;
    }
  if (!lamina_comparison_write_pdf (job.output, globals->force, &options, a, NULL, b, NULL, &error))
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  fprintf (lamina_cli_message_stream (job.output), _("%s and %s: comparison written to %s\n"), a->code ? a->code : a->id, b->code ? b->code : b->id,
          job.output);
  return LAMINA_EXIT_OK;
}
