/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli job list | show | sheets: the jobs of the library, one job
 * with its schedule checked against its targets, and its sheet set. */
#define G_LOG_DOMAIN "lamina-cli"

#include "config.h"

#include "lamina-cli-job.h"
#include "lamina-cli-report.h"
#include "lamina-file.h"
#include "lamina-revision-diff.h"
#include "lamina-sheet.h"
#include "lamina-sheet-format.h"

#include <glib/gi18n.h>
#include <math.h>
#include <stdio.h>

/* job list [--json] */
int
lamina_cli_job_list (const LaminaCliGlobals *globals,
                     int                     argc,
                     char                  **argv)
{
  gboolean json = FALSE;
  int status;
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GPtrArray) jobs = NULL;
  g_autoptr(GError) error = NULL;

  library = lamina_cli_open_listing (globals, _("— list the jobs of the library"), _("Print JSON"), 0,
                                     _("job list takes no arguments (see “lamina-cli job list --help”)"),
                                     &argc, &argv, &json, &status);
  if (library == NULL)
    return status;
  jobs = lamina_library_list_jobs (library, &error);
  if (jobs == NULL)
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  if (json)
    {
      g_autoptr(JsonBuilder) b = json_builder_new ();

      json_builder_begin_object (b);
      json_builder_set_member_name (b, "jobs");
      json_builder_begin_array (b);
      for (guint i = 0; i < jobs->len; i++)
        {
          const LaminaJob *job = jobs->pdata[i];

          json_builder_begin_object (b);
          lamina_cli_json_add_string (b, "id", job->id);
          lamina_cli_json_add_string (b, "name", job->name);
          lamina_cli_json_add_string (b, "number", job->number);
          lamina_cli_json_add_string (b, "client", job->client);
          lamina_cli_json_add_string (b, "status", lamina_job_status_to_string (job->status));
          lamina_cli_json_add_string (b, "target_set", job->target_set);
          json_builder_set_member_name (b, "n_entries");
          json_builder_add_int_value (b, job->entries->len);
          json_builder_end_object (b);
        }
      json_builder_end_array (b);
      json_builder_end_object (b);
      lamina_cli_print_json (json_builder_get_root (b));
      return LAMINA_EXIT_OK;
    }
  for (guint i = 0; i < jobs->len; i++)
    {
      const LaminaJob *job = jobs->pdata[i];

      printf ("%-12s %-10s %-10s %s (%u)\n", job->id, job->number ? job->number : "–",
              lamina_job_status_to_string (job->status), job->name, job->entries->len);
    }
  return LAMINA_EXIT_OK;
}

static const char *
moisture_verdict_name (const LaminaJobLine *line)
{
  switch (line->moisture_verdict)
    {
    case LAMINA_VERDICT_MET:
      return "met";
    case LAMINA_VERDICT_NOT_MET:
      return "not-met";
    case LAMINA_VERDICT_NOT_CALCULATED:
      return "not-assessed";
    case LAMINA_VERDICT_NO_TARGET:
    case LAMINA_N_VERDICTS:
    default:
      return NULL;
    }
}

static void
add_moisture (JsonBuilder         *b,
              const LaminaJobLine *line)
{
  gboolean frsi_asked = line->target != NULL && !isnan (line->target->min_frsi);

  lamina_cli_json_add_number (b, "frsi", frsi_asked ? line->frsi : NAN);
  lamina_cli_json_add_number (b, "min_frsi", frsi_asked ? line->target->min_frsi : NAN);
  json_builder_set_member_name (b, "frsi_met");
  if (frsi_asked && !isnan (line->frsi))
    json_builder_add_boolean_value (b, !(line->flags & LAMINA_ENTRY_FRSI_NOT_MET));
  else
    json_builder_add_null_value (b);
  lamina_cli_json_add_string (b, "moisture_criterion", line->target != NULL && line->target->moisture != LAMINA_MOISTURE_NONE
                              ? lamina_moisture_criterion_to_string (line->target->moisture) : NULL);
  lamina_cli_json_add_string (b, "moisture", moisture_verdict_name (line));
  if (line->moisture != NULL)
    {
      lamina_cli_json_add_number (b, "max_accumulation", line->moisture->max_accumulation);
      json_builder_set_member_name (b, "dries_out");
      json_builder_add_boolean_value (b, line->moisture->dries_out);
    }
}

static void
add_differences (JsonBuilder *b,
                 GPtrArray   *differences)
{
  if (differences == NULL)
    return;
  json_builder_set_member_name (b, "differences");
  json_builder_begin_array (b);
  for (guint i = 0; i < differences->len; i++)
    json_builder_add_string_value (b, differences->pdata[i]);
  json_builder_end_array (b);
}

static void
add_line (JsonBuilder         *b,
          LaminaLibrary       *library,
          const LaminaJobLine *line)
{
  g_autoptr(GPtrArray) differences = lamina_revision_diff_job_entry (library, line->entry);
  const LaminaJobEntry *e = line->entry;
  const LaminaConstruction *c = line->construction;
  static const struct { LaminaEntryFlags flag; const char *name; } flag_names[] = {
    { LAMINA_ENTRY_NOT_APPROVED, "not-approved" },
    { LAMINA_ENTRY_NEWER_APPROVED, "newer-approved" },
    { LAMINA_ENTRY_MATERIAL_CHANGED, "material-changed" },
    { LAMINA_ENTRY_OUT_OF_SCOPE, "out-of-scope" },
    { LAMINA_ENTRY_WRONG_ELEMENT, "wrong-element" },
    { LAMINA_ENTRY_FRSI_NOT_MET, "frsi-not-met" },
    { LAMINA_ENTRY_MOISTURE_OPEN, "moisture-not-assessed" },
    { LAMINA_ENTRY_WARNINGS, "warnings" },
    { LAMINA_ENTRY_MISSING, "missing" },
    { LAMINA_ENTRY_MOISTURE_NOT_MET, "moisture-not-met" },
    { LAMINA_ENTRY_CLIMATE_CHANGED, "climate-changed" },
  };

  json_builder_begin_object (b);
  json_builder_set_member_name (b, "n");
  json_builder_add_int_value (b, e->n);
  lamina_cli_json_add_string (b, "construction", e->construction);
  json_builder_set_member_name (b, "revision");
  json_builder_add_int_value (b, e->revision);
  lamina_cli_json_add_string (b, "code", c != NULL ? c->code : NULL);
  lamina_cli_json_add_string (b, "name", c != NULL ? c->name : NULL);
  lamina_cli_json_add_string (b, "element", c != NULL ? lamina_element_to_string (c->element) : NULL);
  lamina_cli_json_add_string (b, "use", e->use);
  lamina_cli_json_add_string (b, "location", e->location);
  lamina_cli_json_add_number (b, "u", line->u);
  lamina_cli_json_add_string (b, "method", isfinite (line->u) ? lamina_cli_method (c->has_ground) : NULL);
  lamina_cli_json_add_number (b, "target", line->max_u);
  json_builder_set_member_name (b, "met");
  if (line->verdict == LAMINA_VERDICT_MET || line->verdict == LAMINA_VERDICT_NOT_MET)
    json_builder_add_boolean_value (b, line->verdict == LAMINA_VERDICT_MET);
  else
    json_builder_add_null_value (b);
  lamina_cli_json_add_number (b, "area", e->area);
  lamina_cli_json_add_number (b, "ua", line->ua);
  lamina_cli_json_add_string (b, "verdict", lamina_verdict_to_string (line->verdict));
  lamina_cli_json_add_string (b, "origin", e->origin);
  if (e->origin != NULL)
    {
      json_builder_set_member_name (b, "origin_revision");
      json_builder_add_int_value (b, e->origin_revision);
    }
  add_differences (b, differences);
  add_moisture (b, line);
  json_builder_set_member_name (b, "flags");
  json_builder_begin_array (b);
  for (guint i = 0; i < G_N_ELEMENTS (flag_names); i++)
    if (line->flags & flag_names[i].flag)
      json_builder_add_string_value (b, flag_names[i].name);
  json_builder_end_array (b);
  json_builder_set_member_name (b, "notes");
  json_builder_begin_array (b);
  for (guint i = 0; i < line->notes->len; i++)
    json_builder_add_string_value (b, line->notes->pdata[i]);
  json_builder_end_array (b);
  json_builder_end_object (b);
}

static void
add_totals (JsonBuilder          *b,
            const LaminaJobCheck *check)
{
  lamina_cli_json_add_number (b, "h_t", check->h_t);
  lamina_cli_json_add_number (b, "h_junctions", check->h_junctions);
  lamina_cli_json_add_number (b, "h_total", check->h_total);
  lamina_cli_json_add_number (b, "area", check->area);
  json_builder_set_member_name (b, "mean_u");
  json_builder_begin_object (b);
  for (guint k = 0; k < LAMINA_N_ELEMENTS; k++)
    if (check->kinds[k].area > 0)
      lamina_cli_json_add_number (b, lamina_element_to_string ((LaminaElement) k),
                                  check->kinds[k].mean_u);
  json_builder_end_object (b);
  json_builder_set_member_name (b, "n_met");
  json_builder_add_int_value (b, check->n_met);
  json_builder_set_member_name (b, "n_not_met");
  json_builder_add_int_value (b, check->n_not_met);
  json_builder_set_member_name (b, "n_open");
  json_builder_add_int_value (b, check->n_open);
}

static void
add_job_data (JsonBuilder     *b,
              const LaminaJob *job,
              gboolean         climate_unknown)
{
  lamina_cli_json_add_string (b, "id", job->id);
  lamina_cli_json_add_string (b, "name", job->name);
  lamina_cli_json_add_string (b, "number", job->number);
  lamina_cli_json_add_string (b, "client", job->client);
  lamina_cli_json_add_string (b, "site", job->site);
  lamina_cli_json_add_string (b, "architect", job->architect);
  lamina_cli_json_add_string (b, "status", lamina_job_status_to_string (job->status));
  lamina_cli_json_add_string (b, "target_set", job->target_set);
  lamina_cli_json_add_string (b, "climate", job->climate);
  json_builder_set_member_name (b, "climate_known");
  if (job->climate != NULL)
    json_builder_add_boolean_value (b, !climate_unknown);
  else
    json_builder_add_null_value (b);
  lamina_cli_json_add_number (b, "inside_temperature", job->inside_temperature);
  lamina_cli_json_add_number (b, "outside_temperature", job->outside_temperature);
  lamina_cli_json_add_number (b, "ground_b_prime", lamina_job_get_b_prime (job));
}

static void
add_junctions_and_log (JsonBuilder     *b,
                       const LaminaJob *job)
{
  json_builder_set_member_name (b, "junctions");
  json_builder_begin_array (b);
  for (guint i = 0; i < job->junctions->len; i++)
    {
      const LaminaJobJunction *j = job->junctions->pdata[i];

      json_builder_begin_object (b);
      json_builder_set_member_name (b, "n");
      json_builder_add_int_value (b, j->n);
      lamina_cli_json_add_string (b, "name", j->name);
      lamina_cli_json_add_number (b, "psi", j->psi);
      lamina_cli_json_add_number (b, "length", j->length);
      lamina_cli_json_add_number (b, "psi_l", j->psi * j->length);
      json_builder_end_object (b);
    }
  json_builder_end_array (b);
  json_builder_set_member_name (b, "log");
  json_builder_begin_array (b);
  for (guint i = 0; i < job->log->len; i++)
    {
      const LaminaJobEvent *event = job->log->pdata[i];

      json_builder_begin_object (b);
      lamina_cli_json_add_string (b, "at", event->at);
      lamina_cli_json_add_string (b, "by", event->by);
      lamina_cli_json_add_string (b, "text", event->text);
      json_builder_end_object (b);
    }
  json_builder_end_array (b);
}

static void
print_json (LaminaLibrary         *library,
            const LaminaJobReport *report)
{
  g_autoptr(JsonBuilder) b = json_builder_new ();

  json_builder_begin_object (b);
  json_builder_set_member_name (b, "job");
  json_builder_begin_object (b);
  add_job_data (b, report->job, report->climate_unknown);
  json_builder_set_member_name (b, "entries");
  json_builder_begin_array (b);
  for (guint i = 0; i < report->check->lines->len; i++)
    add_line (b, library, report->check->lines->pdata[i]);
  json_builder_end_array (b);
  add_totals (b, report->check);
  add_junctions_and_log (b, report->job);
  json_builder_end_object (b);
  json_builder_end_object (b);
  lamina_cli_print_json (json_builder_get_root (b));
}

static const char *
verdict_text (LaminaVerdict verdict)
{
  switch (verdict)
    {
    case LAMINA_VERDICT_MET:
      return _("met");
    case LAMINA_VERDICT_NOT_MET:
      return _("NOT MET");
    case LAMINA_VERDICT_NO_TARGET:
      return _("no target");
    case LAMINA_VERDICT_NOT_CALCULATED:
    case LAMINA_N_VERDICTS:
    default:
      return _("not calculated");
    }
}

/* The fRsi and moisture criteria of the entry's target, when it asks. */
static void
print_moisture (const LaminaJobLine *l)
{
  g_autofree char *text = lamina_job_line_dup_moisture_text (l);

  if (text != NULL)
    printf ("       %s\n", text);
}

static void
print_differences (LaminaLibrary        *library,
                   const LaminaJobEntry *e)
{
  g_autoptr(GPtrArray) differences = lamina_revision_diff_job_entry (library, e);

  if (differences == NULL)
    return;
  printf (_("       job variant of %s revision %d:%s\n"), e->origin, e->origin_revision,
          differences->len == 0 ? _(" no difference yet") : "");
  for (guint i = 0; i < differences->len; i++)
    printf ("         – %s\n", (const char *) differences->pdata[i]);
}

static void
print_text (LaminaLibrary         *library,
            const LaminaJobReport *report)
{
  const LaminaJob *job = report->job;
  const LaminaJobCheck *check = report->check;
  gboolean ground = FALSE;
  g_autofree char *caution = NULL;
  char inside[LAMINA_FORMAT_SIZE], outside[LAMINA_FORMAT_SIZE];

  printf ("%s %s — %s\n", job->number ? job->number : "", job->name,
          lamina_job_status_to_string (job->status));
  if (job->client)
    printf (_("Client: %s\n"), job->client);
  if (job->architect)
    printf (_("Architect: %s\n"), job->architect);
  /* Human text takes the minus sign U+2212, as the sheets do. */
  printf (_("Targets: %s; design conditions %s inside, %s outside\n"),
          report->targets ? report->targets->name : _("none"),
          lamina_format_temperature (inside, job->inside_temperature),
          lamina_format_temperature (outside, job->outside_temperature));
  if (job->climate != NULL)
    printf (report->climate_unknown ? _("Climate: %s — NOT IN THE LIBRARY; moisture checks use each "
                                        "construction's own climate\n")
                                    : _("Climate: %s\n"), job->climate);
  printf ("\n%3s  %-14s %-4s %-18s %7s %7s %-10s %8s %8s\n", "#", _("construction"), _("rev"),
          _("use"), "U", _("max U"), _("verdict"), "A m²", "U·A W/K");
  for (guint i = 0; i < check->lines->len; i++)
    {
      const LaminaJobLine *l = check->lines->pdata[i];
      const LaminaConstruction *c = l->construction;

      printf ("%3d  %-14s %-4d %-18s %7.3f %7.3f %-10s %8.1f %8.2f\n", l->entry->n,
              c != NULL && c->code ? c->code : l->entry->construction, l->entry->revision,
              l->entry->use, l->u, l->max_u, verdict_text (l->verdict), l->entry->area, l->ua);
      for (guint k = 0; k < l->notes->len; k++)
        printf ("       ! %s\n", (const char *) l->notes->pdata[k]);
      ground |= c != NULL && c->has_ground && isfinite (l->u);
      print_moisture (l);
      print_differences (library, l->entry);
    }
  printf (_("\nH_T of the listed elements' fabric only (Σ U·A): %.2f W/K over %.1f m²\n"),
          check->h_t, check->area);
  if (job->junctions->len > 0)
    printf (_("Linear thermal bridges entered by hand (Σ ψ·l): %.2f W/K; together %.2f W/K\n"),
            check->h_junctions, check->h_total);
  printf (_("%u met, %u not met, %u open\n"), check->n_met, check->n_not_met, check->n_open);
  caution = lamina_cli_caution (ground ? LAMINA_CLI_CAUTION_MIXED : LAMINA_CLI_CAUTION_LAYERS);
  printf ("%s\n", caution);
}

/* job show JOB [--json] */
int
lamina_cli_job_show (const LaminaCliGlobals *globals,
                     int                     argc,
                     char                  **argv)
{
  gboolean json = FALSE;
  int status;
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(LaminaJobReport) report = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *id = NULL;

  library = lamina_cli_open_listing (globals, _("JOB — a job, its schedule and its check (JOB: its id or "
                                                "job number; see “lamina-cli job --help”)"),
                                     _("Print JSON (U in W/(m²·K), area in m², U·A and H_T in W/K)"), 1,
                                     _("job show takes one job id (see “lamina-cli job show --help”)"),
                                     &argc, &argv, &json, &status);
  if (library == NULL)
    return status;
  if ((id = lamina_cli_job_resolve (library, argv[1])) == NULL)
    return LAMINA_EXIT_BAD_INPUT;
  report = lamina_library_check_job (library, id, &error);
  if (report == NULL)
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  if (json)
    print_json (library, report);
  else
    print_text (library, report);
  return LAMINA_EXIT_OK;
}

/* job sheets JOB -o FILE.pdf [--practice NAME] [--paper SIZE] */
int
lamina_cli_job_sheets (const LaminaCliGlobals *globals,
                       int                     argc,
                       char                  **argv)
{
  g_autofree char *output = NULL, *practice = NULL, *paper = NULL;
  const GOptionEntry entries[] = {
    { "output", 'o', 0, G_OPTION_ARG_FILENAME, &output, N_("Write to FILE (“-”: standard output)"), "FILE" },
    { "practice", 0, 0, G_OPTION_ARG_STRING, &practice, N_("Practice name in the header"), "NAME" },
    { "paper", 0, 0, G_OPTION_ARG_STRING, &paper, N_("Paper size: a4, a3 or letter"), "SIZE" },
    { NULL }
  };
  g_autoptr(GOptionContext) context = g_option_context_new (_("JOB — print a job's sheet set to one PDF"));
  g_autoptr(LaminaLibrary) library = NULL;
  g_autofree char *id = NULL;
  g_autoptr(LaminaJobReport) report = NULL;
  g_autoptr(GError) error = NULL;
  LaminaSheetOptions options;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  g_option_context_set_description (context, lamina_cli_job_key_help ());
  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (argc != 2)
    {
      lamina_cli_error (_("usage: job sheets JOB -o FILE.pdf"));
      return LAMINA_EXIT_USAGE;
    }
  if (output == NULL)
    {
      lamina_cli_error (_("-o FILE is required"));
      return LAMINA_EXIT_USAGE;
    }
  lamina_sheet_options_init (&options);
  if (paper && !lamina_paper_from_string (paper, &options.paper))
    {
      lamina_cli_error (_("--paper: unknown paper “%s” (a4, a3 or letter)"), paper);
      return LAMINA_EXIT_USAGE;
    }
  options.practice = practice;
  if (!lamina_file_check_target (output, globals->force, &error))
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  library = lamina_cli_open_library (globals, FALSE);
  if (library == NULL || (id = lamina_cli_job_resolve (library, argv[1])) == NULL)
    return LAMINA_EXIT_BAD_INPUT;
  options.moisture_limit = lamina_library_get_moisture_limit (library);
  report = lamina_library_check_job (library, id, &error);
  if (report != NULL)
    lamina_revision_diff_note_variants (library, report);
  if (report == NULL
      || !lamina_sheet_write_job (output, globals->force, &options, report->job, report->targets,
                                  report->check, &error))
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  fprintf (lamina_cli_message_stream (output),
           g_dngettext (GETTEXT_PACKAGE, "job “%s”: %u entry, sheet set written to %s\n",
                        "job “%s”: %u entries, sheet set written to %s\n", report->check->lines->len),
           report->job->id, report->check->lines->len, output);
  return LAMINA_EXIT_OK;
}
