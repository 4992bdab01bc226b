/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli list | show | history | materials | check | approve: the
 * office library from the command line. */
#define G_LOG_DOMAIN "lamina-cli"

#include "config.h"

#include "lamina-cli.h"
#include "lamina-cli-library.h"
#include "lamina-cli-report.h"
#include "lamina-library.h"
#include "lamina-library-safety.h"
#include "lamina-number.h"

#include <glib/gi18n.h>
#include <stdio.h>
#include <stdlib.h>
#include <math.h>
#include <string.h>
#include <sys/ioctl.h>
#include <unistd.h>

LaminaLibrary *
lamina_cli_open_library (const LaminaCliGlobals *globals,
                         gboolean                create)
{
  g_autoptr(GError) error = NULL;
  LaminaLibraryOpenFlags flags = LAMINA_LIBRARY_OPEN_DEFAULT;
  LaminaLibrary *library;

  /* A mistyped --library PATH must not become a new empty library. */
  if (globals->library_path != NULL && !create)
    flags |= LAMINA_LIBRARY_OPEN_EXISTING;
  library = lamina_library_open (globals->library_path, flags, &error);
  if (library == NULL)
    {
      lamina_cli_error ("%s", error->message);
      return NULL;
    }
  lamina_cli_library_opened (library);
  return library;
}

LaminaLibrary *
lamina_cli_open_listing (const LaminaCliGlobals *globals,
                         const char             *parameter_string,
                         const char             *json_help,
                         int                     n_args,
                         const char             *wrong_args,
                         int                    *argc,
                         char                 ***argv,
                         gboolean               *json,
                         int                    *exit_code)
{
  const GOptionEntry entries[] = {
    { "json", 0, 0, G_OPTION_ARG_NONE, json, json_help, NULL },
    { NULL }
  };
  g_autoptr(GOptionContext) context = g_option_context_new (parameter_string);
  LaminaLibrary *library;

  *exit_code = LAMINA_EXIT_USAGE;
  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!lamina_cli_parse (context, argc, argv))
    return NULL;
  if (*argc != n_args + 1)
    {
      lamina_cli_error ("%s", wrong_args);
      return NULL;
    }
  *exit_code = LAMINA_EXIT_BAD_INPUT;
  library = lamina_cli_open_library (globals, FALSE);
  if (library != NULL)
    *exit_code = LAMINA_EXIT_OK;
  return library;
}

void
lamina_cli_print_json (JsonNode *root)
{
  g_autoptr(JsonGenerator) gen = json_generator_new ();
  g_autofree char *text = NULL;

  json_generator_set_pretty (gen, TRUE);
  json_generator_set_root (gen, root);
  text = json_generator_to_data (gen, NULL);
  printf ("%s\n", text);
  json_node_unref (root);
}

/* Every numeric option names itself and its allowed range when refused. */
static gboolean
parse_u (const char *text,
         const char *option,
         double     *value)
{
  g_autoptr(GError) error = NULL;

  if (text == NULL)
    return TRUE;
  if (!lamina_number_parse (LAMINA_FIELD_U_FILTER, text, value, &error))
    {
      lamina_cli_error ("%s: %s", option, error->message);
      return FALSE;
    }
  return TRUE;
}

gboolean
lamina_cli_parse_revision (const char *text,
                           int        *revision)
{
  guint64 n = 0;

  if (text == NULL)
    return TRUE;
  if (!g_ascii_string_to_unsigned (text, 10, 1, G_MAXINT, &n, NULL))
    {
      lamina_cli_error (_("--revision: “%s” is not a revision number (allowed: 1 to %d)"),
                        text, G_MAXINT);
      return FALSE;
    }
  *revision = (int) n;
  return TRUE;
}

gboolean
lamina_cli_parse_status (const char   *text,
                         LaminaStatus *status)
{
  /* "Approved" as typed at the start of a sentence is still a status. */
  g_autofree char *lower = g_ascii_strdown (text, -1);

  if (lamina_status_from_string (lower, status))
    return TRUE;
  lamina_cli_error (_("--status: unknown status “%s” (draft, checked, approved)"), text);
  return FALSE;
}

/* YYYY-MM-DD, a real calendar date from 1900 to 2999. */
static gboolean
parse_date (const char *text)
{
  int y = 0, m = 0, d = 0;
  char tail;

  if (text == NULL)
    return TRUE;
  if (strlen (text) != 10 || sscanf (text, "%4d-%2d-%2d%c", &y, &m, &d, &tail) != 3
      || !g_ascii_isdigit (text[0]) || text[4] != '-' || text[7] != '-'
      || y < 1900 || y > 2999 || !g_date_valid_dmy ((GDateDay) d, (GDateMonth) m, (GDateYear) y))
    {
      lamina_cli_error (_("--date: “%s” is not a date (allowed: YYYY-MM-DD, 1900-01-01 to 2999-12-31)"),
                        text);
      return FALSE;
    }
  return TRUE;
}

/* The width of the terminal on standard output, or 0 when the output goes
 * to a file or a pipe (then nothing is cut). */
static int
get_terminal_columns (void)
{
  struct winsize size;
  const char *columns;

  if (!isatty (STDOUT_FILENO))
    return 0;
  if (ioctl (STDOUT_FILENO, TIOCGWINSZ, &size) == 0 && size.ws_col > 0)
    return size.ws_col;
  columns = g_getenv ("COLUMNS");
  return columns ? MAX (atoi (columns), 0) : 80;
}

/* Pads or cuts @text to @width characters; a cut ends in an ellipsis. */
static char *
dup_cell (const char *text,
          int         width)
{
  long length = g_utf8_strlen (text, -1);
  g_autofree char *cut = NULL;

  if (length <= width)
    return g_strdup_printf ("%s%*s", text, (int) (width - length), "");
  cut = g_utf8_substring (text, 0, MAX (width - 1, 0));
  return g_strconcat (cut, "…", NULL);
}

static void
print_list (GPtrArray *rows)
{
  /* CODE 10, ELEMENT 9, STATUS 8, REV 4, U 7, MM 7, and the spaces. */
  const int others = 10 + 9 + 8 + 4 + 7 + 7 + 6;
  int columns = get_terminal_columns (), width = (int) g_utf8_strlen (_("NAME"), -1);
  g_autofree char *header = NULL;

  for (guint i = 0; i < rows->len; i++)
    width = MAX (width, (int) g_utf8_strlen (((LaminaSummary *) rows->pdata[i])->name, -1));
  /* Full names, unless the terminal is too narrow for them. */
  if (columns > 0 && others + width > columns)
    width = MAX (columns - others, 16);
  header = dup_cell (_("NAME"), width);
  printf ("%-10s %s %-9s %-8s %4s %7s %7s\n", _("CODE"), header, _("ELEMENT"), _("STATUS"), _("REV"), _("U"),
          _("MM"));
  for (guint i = 0; i < rows->len; i++)
    {
      LaminaSummary *s = rows->pdata[i];
      g_autofree char *name = dup_cell (s->name, width);
      char u[LAMINA_U_TEXT_SIZE];

      /* U as everywhere (lamina_format_u, "0.20" not "0.2"); thickness to
       * one decimal everywhere (a 12.5 mm board is common).  The width
       * counts characters: "–" (no U) is three bytes. */
      lamina_format_u (u, s->u_corrected);
      printf ("%-10s %s %-9s %-8s %4d %*s %7.1f%s%s\n", s->code ? s->code : "-", name,
              lamina_element_to_string (s->element), lamina_status_to_string (s->status),
              s->revision, 7 + (int) (strlen (u) - g_utf8_strlen (u, -1)), u, s->thickness,
              (s->flags & LAMINA_SUMMARY_MATERIAL_CHANGED) ? _("  material data changed since review") : "",
              (s->flags & LAMINA_SUMMARY_MOISTURE_FAILS) ? _("  fails its moisture check") : "");
    }
}

static const char *const sort_names[LAMINA_N_SORTS] = {
  [LAMINA_SORT_CODE] = "code",
  [LAMINA_SORT_NAME] = "name",
  [LAMINA_SORT_U] = "u",
  [LAMINA_SORT_THICKNESS] = "thickness",
  [LAMINA_SORT_MODIFIED] = "modified",
  [LAMINA_SORT_RELEVANCE] = "relevance",
};

static gboolean
parse_sort (const char    *text,
            LaminaSortKey *sort)
{
  if (text == NULL)
    return TRUE;
  for (guint i = 0; i < LAMINA_N_SORTS; i++)
    if (sort_names[i] != NULL && strcmp (text, sort_names[i]) == 0)
      {
        *sort = (LaminaSortKey) i;
        return TRUE;
      }
  lamina_cli_error (_("--sort: unknown order “%s” (code, name, u, thickness, modified, relevance)"), text);
  return FALSE;
}

/* list [--search TEXT] [--element E] [--status S] [--max-u X]
 *      [--meets U] [--sort KEY] [--json]
 * --meets U is the design question "which of ours reach U?": the
 * constructions whose corrected U is at most U; with --sort thickness the
 * thinnest comes first. */
/* list's filter options into @q; FALSE (the option named on stderr) when
 * one is not understood. */
static gboolean
parse_list_filters (const char         *element,
                    const char         *status,
                    const char         *max_u,
                    const char         *meets,
                    const char         *sort,
                    LaminaLibraryQuery *q)
{
  LaminaElement el;
  LaminaStatus st;

  if (element != NULL)
    {
      g_autofree char *lower = g_ascii_strdown (element, -1);

      if (!lamina_element_from_string (lower, &el))
        {
          lamina_cli_error (_("--element: unknown element “%s” (wall, roof, floor, ceiling, partition)"), element);
          return FALSE;
        }
      q->element = el;
    }
  if (status != NULL)
    {
      if (!lamina_cli_parse_status (status, &st))
        return FALSE;
      q->status = st;
    }
  if (!parse_u (max_u, "--max-u", &q->max_u) || !parse_sort (sort, &q->sort))
    return FALSE;
  if (meets != NULL)
    {
      double target;

      if (!parse_u (meets, "--meets", &target))
        return FALSE;
      q->max_u = isnan (q->max_u) ? target : MIN (q->max_u, target);
    }
  return TRUE;
}

/* list --json: {"constructions": [...]}, SI units. */
static void
print_list_json (GPtrArray *rows)
{
  g_autoptr(JsonBuilder) b = json_builder_new ();

  json_builder_begin_object (b);
  json_builder_set_member_name (b, "constructions");
  json_builder_begin_array (b);
  for (guint i = 0; i < rows->len; i++)
    {
      LaminaSummary *s = rows->pdata[i];

      json_builder_begin_object (b);
      lamina_cli_json_add_string (b, "id", s->id);
      lamina_cli_json_add_string (b, "code", s->code);
      lamina_cli_json_add_string (b, "name", s->name);
      lamina_cli_json_add_string (b, "element", lamina_element_to_string (s->element));
      lamina_cli_json_add_string (b, "status", lamina_status_to_string (s->status));
      json_builder_set_member_name (b, "revision");
      json_builder_add_int_value (b, s->revision);
      lamina_cli_json_add_number (b, "u", s->u);
      lamina_cli_json_add_number (b, "u_corrected", s->u_corrected);
      lamina_cli_json_add_number (b, "target_u", s->target_u);
      lamina_cli_json_add_number (b, "thickness", s->thickness / 1000.0);
      json_builder_set_member_name (b, "material_changed");
      json_builder_add_boolean_value (b, (s->flags & LAMINA_SUMMARY_MATERIAL_CHANGED) != 0);
      json_builder_set_member_name (b, "moisture_fails");
      json_builder_add_boolean_value (b, (s->flags & LAMINA_SUMMARY_MOISTURE_FAILS) != 0);
      json_builder_end_object (b);
    }
  json_builder_end_array (b);
  json_builder_end_object (b);
  lamina_cli_print_json (json_builder_get_root (b));
}

int
lamina_cli_list (const LaminaCliGlobals *globals,
                 int                     argc,
                 char                  **argv)
{
  g_autofree char *search = NULL, *element = NULL, *status = NULL, *max_u = NULL;
  g_autofree char *tag = NULL, *meets = NULL, *sort = NULL, *moisture = NULL;
  gboolean json = FALSE;
  const GOptionEntry entries[] = {
    { "search", 0, 0, G_OPTION_ARG_STRING, &search, N_("Words to find (prefixes of code, name, description, tags, materials)"), "TEXT" },
    { "element", 0, 0, G_OPTION_ARG_STRING, &element, N_("Only this element: wall, roof, floor, ceiling, partition"), "E" },
    { "status", 0, 0, G_OPTION_ARG_STRING, &status, N_("Only this status: draft, checked, approved"), "S" },
    { "tag", 0, 0, G_OPTION_ARG_STRING, &tag, N_("Only constructions with this tag"), "TAG" },
    { "max-u", 0, 0, G_OPTION_ARG_STRING, &max_u, N_("Only corrected U up to X W/(m²·K)"), "X" },
    { "meets", 0, 0, G_OPTION_ARG_STRING, &meets, N_("Only constructions that meet the target U (corrected U ≤ U)"), "U" },
    { "sort", 0, 0, G_OPTION_ARG_STRING, &sort, N_("Order: code, name, u, thickness, modified, relevance"), "KEY" },
    { "json", 0, 0, G_OPTION_ARG_NONE, &json, N_("Print JSON (SI units: thickness in m)"), NULL },
    { "moisture", 0, 0, G_OPTION_ARG_STRING, &moisture,
      N_("“fails”: only constructions that fail their EN ISO 13788 check"), "fails" },
    { NULL }
  };
  g_autoptr(GOptionContext) context = g_option_context_new (_("— list the constructions of the library"));
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GPtrArray) rows = NULL;
  g_autoptr(GError) error = NULL;
  LaminaLibraryQuery q;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (argc != 1)
    {
      lamina_cli_error (_("list takes no arguments (see “lamina-cli list --help”)"));
      return LAMINA_EXIT_USAGE;
    }
  lamina_library_query_init (&q);
  q.text = search;
  q.tag = tag;
  if (!parse_list_filters (element, status, max_u, meets, sort, &q))
    return LAMINA_EXIT_USAGE;
  if (moisture != NULL && strcmp (moisture, "fails") != 0)
    {
      lamina_cli_error (_("--moisture: unknown filter “%s” (fails)"), moisture);
      return LAMINA_EXIT_USAGE;
    }
  q.moisture_fails_only = moisture != NULL;

  library = lamina_cli_open_library (globals, FALSE);
  if (library == NULL)
    return LAMINA_EXIT_BAD_INPUT;
  rows = lamina_library_search (library, &q, &error);
  if (rows == NULL)
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  if (json)
    print_list_json (rows);
  else
    print_list (rows);
  return LAMINA_EXIT_OK;
}

/* Finds a construction by id or, failing that, by office code. */
char *
lamina_cli_resolve_id (LaminaLibrary *library,
                       const char    *key)
{
  g_autoptr(LaminaConstruction) c = lamina_library_dup_construction (library, key, 0, NULL);
  g_autoptr(GPtrArray) rows = NULL;
  LaminaLibraryQuery q;

  if (c != NULL)
    return g_strdup (key);
  lamina_library_query_init (&q);
  q.text = key;
  rows = lamina_library_search (library, &q, NULL);
  for (guint i = 0; rows != NULL && i < rows->len; i++)
    {
      LaminaSummary *s = rows->pdata[i];

      if (g_strcmp0 (s->code, key) == 0)
        return g_strdup (s->id);
    }
  lamina_cli_error (_("%s: no construction with id or code “%s”"),
                    lamina_library_get_path (library), key);
  return NULL;
}

/* The jobs whose schedules pin @id, one line each. */
static void
print_job_uses (LaminaLibrary *library,
                const char    *id)
{
  g_autoptr(GPtrArray) uses = lamina_library_list_job_uses (library, id, NULL);

  for (guint i = 0; uses != NULL && i < uses->len; i++)
    {
      const LaminaJobUse *use = uses->pdata[i];

      printf (_("Used in job %s %s (entry %d, revision %d, %s)\n"),
              use->job_number ? use->job_number : use->job_id, use->job_name, use->entry,
              use->revision, use->use);
    }
}

/* show ID [--revision N] [--json] */
int
lamina_cli_show (const LaminaCliGlobals *globals,
                 int                     argc,
                 char                  **argv)
{
  gboolean json = FALSE;
  int revision = 0;
  g_autofree char *revision_text = NULL;
  const GOptionEntry entries[] = {
    { "revision", 0, 0, G_OPTION_ARG_STRING, &revision_text, N_("Show this revision (default: the latest)"), "N" },
    { "json", 0, 0, G_OPTION_ARG_NONE, &json, N_("Print JSON with the keys of “calc --json”"), NULL },
    { NULL }
  };
  g_autoptr(GOptionContext) context = g_option_context_new (_("ID — show a construction and its figures"));
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(LaminaConstruction) c = NULL;
  g_autoptr(LaminaResult) result = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *id = NULL;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (argc != 2)
    {
      lamina_cli_error (_("show takes one construction id (see “lamina-cli show --help”)"));
      return LAMINA_EXIT_USAGE;
    }
  if (!lamina_cli_parse_revision (revision_text, &revision))
    return LAMINA_EXIT_USAGE;
  library = lamina_cli_open_library (globals, FALSE);
  if (library == NULL || (id = lamina_cli_resolve_id (library, argv[1])) == NULL)
    return LAMINA_EXIT_BAD_INPUT;
  c = lamina_library_dup_construction (library, id, revision, &error);
  if (c != NULL)
    result = lamina_library_dup_result (library, id, revision, &error);
  if (result == NULL)
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  if (json)
    {
      g_autoptr(JsonArray) array = json_array_new ();
      g_autofree char *text = NULL;

      JsonNode *node = lamina_cli_result_to_json (c, result);

      json_array_add_element (array, node);
      if (!lamina_cli_add_moisture (node, c, lamina_library_get_moisture_limit (library), &error))
        {
          lamina_cli_error ("%s", error->message);
          return LAMINA_EXIT_BAD_INPUT;
        }
      text = lamina_cli_json_document (g_steal_pointer (&array));
      printf ("%s\n", text);
      return LAMINA_EXIT_OK;
    }
  printf (_("%s, revision %d, %s"), c->code ? c->code : c->id, c->revision,
          lamina_status_to_string (c->status));
  if (c->checked_by)
    printf (_(", checked by %s"), c->checked_by);
  if (c->approved_by)
    printf (_(", approved by %s on %s"), c->approved_by, c->approved_at);
  printf ("\n");
  lamina_cli_print_result (stdout, c, result);
  if (!lamina_cli_print_moisture_own (stdout, c, lamina_library_get_moisture_limit (library), &error))
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  print_job_uses (library, id);
  return LAMINA_EXIT_OK;
}

/* history ID [--json] */
int
lamina_cli_history (const LaminaCliGlobals *globals,
                    int                     argc,
                    char                  **argv)
{
  gboolean json = FALSE;
  int status;
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GPtrArray) history = NULL;
  g_autoptr(GPtrArray) events = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *id = NULL;
  g_autoptr(JsonBuilder) b = json_builder_new ();

  library = lamina_cli_open_listing (globals, _("ID — the revisions of a construction"), _("Print JSON"),
                                     1, _("history takes one construction id"), &argc, &argv, &json, &status);
  if (library == NULL)
    return status;
  if ((id = lamina_cli_resolve_id (library, argv[1])) == NULL)
    return LAMINA_EXIT_BAD_INPUT;
  history = lamina_library_dup_history (library, id, &error);
  if (history == NULL || (events = lamina_library_dup_review_events (library, id, &error)) == NULL)
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  json_builder_begin_object (b);
  json_builder_set_member_name (b, "revisions");
  json_builder_begin_array (b);
  for (guint i = 0; i < history->len; i++)
    {
      LaminaRevisionInfo *r = history->pdata[i];

      if (!json)
        {
          printf ("%3d  %-8s  %s  %s", r->revision, lamina_status_to_string (r->status),
                  r->modified_at, r->modified_by);
          if (r->checked_by)
            printf (_("  checked by %s"), r->checked_by);
          if (r->approved_by)
            printf (_("  approved by %s on %s"), r->approved_by, r->approved_at);
          if (r->comment)
            printf ("  (%s)", r->comment);
          printf ("\n");
          lamina_cli_print_review_events (events, r->revision);
          continue;
        }
      json_builder_begin_object (b);
      json_builder_set_member_name (b, "revision");
      json_builder_add_int_value (b, r->revision);
      lamina_cli_json_add_string (b, "status", lamina_status_to_string (r->status));
      lamina_cli_json_add_string (b, "modified_by", r->modified_by);
      lamina_cli_json_add_string (b, "modified_at", r->modified_at);
      lamina_cli_json_add_string (b, "checked_by", r->checked_by);
      lamina_cli_json_add_string (b, "checked_at", r->checked_at);
      lamina_cli_json_add_string (b, "approved_by", r->approved_by);
      lamina_cli_json_add_string (b, "approved_at", r->approved_at);
      lamina_cli_json_add_string (b, "comment", r->comment);
      lamina_cli_json_add_number (b, "u_corrected", r->u_corrected);
      json_builder_end_object (b);
    }
  json_builder_end_array (b);
  lamina_cli_review_events_to_json (b, events);
  json_builder_end_object (b);
  if (json)
    lamina_cli_print_json (json_builder_get_root (b));
  return LAMINA_EXIT_OK;
}

/* materials [--json] */
int
lamina_cli_materials (const LaminaCliGlobals *globals,
                      int                     argc,
                      char                  **argv)
{
  gboolean json = FALSE;
  int status;
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GPtrArray) list = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(JsonBuilder) b = json_builder_new ();

  library = lamina_cli_open_listing (globals, _("— the materials of the library"), _("Print JSON"),
                                     0, _("materials takes no arguments"), &argc, &argv, &json, &status);
  if (library == NULL)
    return status;
  list = lamina_library_list_materials (library, &error);
  if (list == NULL)
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  json_builder_begin_object (b);
  json_builder_set_member_name (b, "materials");
  json_builder_begin_array (b);
  for (guint i = 0; i < list->len; i++)
    {
      LaminaMaterial *m = list->pdata[i];

      if (!json)
        {
          printf ("%-32s %-11s λ %-7g %s\n", m->id, lamina_category_to_string (m->category),
                  m->conductivity, m->name);
          continue;
        }
      json_builder_begin_object (b);
      lamina_cli_json_add_string (b, "id", m->id);
      lamina_cli_json_add_string (b, "name", m->name);
      lamina_cli_json_add_string (b, "category", lamina_category_to_string (m->category));
      lamina_cli_json_add_number (b, "conductivity", m->conductivity);
      lamina_cli_json_add_number (b, "density", m->density);
      lamina_cli_json_add_number (b, "specific_heat", m->specific_heat);
      lamina_cli_json_add_number (b, "vapour_resistance_factor", m->vapour_resistance_factor);
      lamina_cli_json_add_number (b, "emissivity", m->emissivity);
      lamina_cli_json_add_string (b, "source", m->source);
      json_builder_end_object (b);
    }
  json_builder_end_array (b);
  json_builder_end_object (b);
  if (json)
    lamina_cli_print_json (json_builder_get_root (b));
  return LAMINA_EXIT_OK;
}

/* A reviewer signs for the figures: repeat what the engine warned of (a
 * target not met, the method outside its range) so that nobody approves
 * such a build-up without having read it. */
static void
warn_on_review (LaminaLibrary *library,
                const char    *id)
{
  g_autoptr(LaminaResult) result = lamina_library_dup_result (library, id, 0, NULL);

  if (result == NULL)
    return;
  for (guint i = 0; i < result->warnings->len; i++)
    {
      const LaminaWarning *w = result->warnings->pdata[i];

      if (w->kind == LAMINA_WARNING_TARGET_NOT_MET || w->kind == LAMINA_WARNING_RATIO_OUT_OF_RANGE
          || w->kind == LAMINA_WARNING_METAL_BRIDGED_INSULATION)
        lamina_cli_error (_("caution: %s"), w->message);
    }
}

/* Says what was done, in the words of the review record: "EW-102
 * revision 4 checked by A. Reviewer". */
static void
report_review (LaminaLibrary *library,
               const char    *id,
               int            revision,
               gboolean       approve)
{
  g_autoptr(LaminaConstruction) c = lamina_library_dup_construction (library, id, revision, NULL);
  char date[11] = "";

  if (c == NULL)
    return;
  if (approve)
    {
      if (c->approved_at)
        g_strlcpy (date, c->approved_at, sizeof date);
      printf (_("%s revision %d approved by %s on %s\n"), c->code ? c->code : c->id, c->revision,
              c->approved_by, date);
    }
  else
    printf (_("%s revision %d checked by %s\n"), c->code ? c->code : c->id, c->revision, c->checked_by);
}

static int
review (const LaminaCliGlobals *globals,
        int                     argc,
        char                  **argv,
        gboolean                approve)
{
  g_autofree char *by = NULL, *date = NULL, *id = NULL, *revision_text = NULL, *reason = NULL;
  int revision = 0;
  const GOptionEntry entries[] = {
    { "by", 0, 0, G_OPTION_ARG_STRING, &by, N_("Name of the reviewer (required)"), "NAME" },
    { "revision", 0, 0, G_OPTION_ARG_STRING, &revision_text, N_("The revision reviewed (default: the latest)"), "N" },
    /* Options of approve only: check --help does not list them. */
    { "date", 0, 0, G_OPTION_ARG_STRING, &date, N_("Approval date YYYY-MM-DD (default: today)"), "DATE" },
    { "reason", 0, 0, G_OPTION_ARG_STRING, &reason,
      N_("Why a result outside the method's scope is approved without a 2-D check (recorded, printed on the sheet)"), "TEXT" },
    { NULL }
  };
  GOptionEntry check_entries[G_N_ELEMENTS (entries)];
  g_autoptr(GOptionContext) context = g_option_context_new (approve
    ? _("ID --by NAME — approve the latest revision")
    : _("ID --by NAME — mark the latest revision checked"));
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GError) error = NULL;
  gboolean ok;

  memcpy (check_entries, entries, sizeof entries);
  memset (&check_entries[2], 0, sizeof check_entries[2]);
  memset (&check_entries[3], 0, sizeof check_entries[3]);
  g_option_context_add_main_entries (context, approve ? entries : check_entries, GETTEXT_PACKAGE);
  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (argc != 2 || by == NULL)
    {
      lamina_cli_error (_("%s takes one construction id and --by NAME"), argv[0]);
      return LAMINA_EXIT_USAGE;
    }
  if (!lamina_cli_parse_revision (revision_text, &revision))
    return LAMINA_EXIT_USAGE;
  /* A date that is not a date is a mistake in the command line (exit 2). */
  if (!parse_date (date))
    return LAMINA_EXIT_USAGE;
  if (g_utf8_strlen (g_strstrip (by), -1) == 0 || g_utf8_strlen (by, -1) > 200)
    {
      lamina_cli_error (_("--by: the reviewer's name is required (allowed: 1 to 200 characters)"));
      return LAMINA_EXIT_BAD_INPUT;
    }
  library = lamina_cli_open_library (globals, FALSE);
  if (library == NULL || (id = lamina_cli_resolve_id (library, argv[1])) == NULL)
    return LAMINA_EXIT_BAD_INPUT;
  if (approve)
    ok = lamina_library_approve_with_reason (library, id, revision, by, date, reason, &error);
  else
    ok = lamina_library_mark_checked (library, id, revision, by, &error);
  if (!ok)
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  warn_on_review (library, id);
  report_review (library, id, revision, approve);
  return LAMINA_EXIT_OK;
}

int
lamina_cli_check (const LaminaCliGlobals *globals,
                  int                     argc,
                  char                  **argv)
{
  return review (globals, argc, argv, FALSE);
}

int
lamina_cli_approve (const LaminaCliGlobals *globals,
                    int                     argc,
                    char                  **argv)
{
  return review (globals, argc, argv, TRUE);
}
