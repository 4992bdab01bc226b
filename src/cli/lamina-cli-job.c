/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli job new | add | remove | update | delete (and the dispatch
 * of every job subcommand): a job's data and schedule from the command
 * line. */
#define G_LOG_DOMAIN "lamina-cli"

#include "config.h"

#include "lamina-cli-job.h"

#include <glib/gi18n.h>
#include <math.h>
#include <stdio.h>
#include <string.h>

gboolean
lamina_cli_parse_number (const char *option,
                         const char *text,
                         double      min,
                         double      max,
                         double     *value)
{
  char *end = NULL;
  double v;

  if (text == NULL)
    return TRUE;
  v = g_ascii_strtod (text, &end);
  if (end == text || *end != '\0' || !isfinite (v) || v < min || v > max)
    {
      lamina_cli_error (_("%s: “%s” is not a number from %g to %g"), option, text, min, max);
      return FALSE;
    }
  *value = v;
  return TRUE;
}

/* The job's own fields, shared by new and update. */
typedef struct
{
  char *name, *number, *client, *site, *architect, *status, *targets, *climate;
  char *inside, *outside, *ground_area, *ground_perimeter, *ground_b_prime;
} JobFields;

static void
job_fields_clear (JobFields *f)
{
  char **all[] = { &f->name, &f->number, &f->client, &f->site, &f->architect, &f->status,
                   &f->targets, &f->climate, &f->inside, &f->outside, &f->ground_area,
                   &f->ground_perimeter, &f->ground_b_prime };

  for (guint i = 0; i < G_N_ELEMENTS (all); i++)
    g_clear_pointer (all[i], g_free);
}

G_DEFINE_AUTO_CLEANUP_CLEAR_FUNC (JobFields, job_fields_clear)

static void
add_field_entries (GOptionContext *context,
                   JobFields      *f)
{
  const GOptionEntry entries[] = {
    { "name", 0, 0, G_OPTION_ARG_STRING, &f->name, N_("The job's name"), "NAME" },
    { "number", 0, 0, G_OPTION_ARG_STRING, &f->number, N_("The office's job number"), "N" },
    { "client", 0, 0, G_OPTION_ARG_STRING, &f->client, N_("The client"), "C" },
    { "site", 0, 0, G_OPTION_ARG_STRING, &f->site, N_("The site (free text)"), "TEXT" },
    { "architect", 0, 0, G_OPTION_ARG_STRING, &f->architect, N_("The responsible architect"), "NAME" },
    { "status", 0, 0, G_OPTION_ARG_STRING, &f->status, N_("design, submitted or built"), "S" },
    { "targets", 0, 0, G_OPTION_ARG_STRING, &f->targets, N_("The target set's id (\"\" for none)"), "SET" },
    { "climate", 0, 0, G_OPTION_ARG_STRING, &f->climate, N_("The climate's id"), "ID" },
    { "inside-temperature", 0, 0, G_OPTION_ARG_STRING, &f->inside, N_("Inside design temperature, °C"), "T" },
    { "outside-temperature", 0, 0, G_OPTION_ARG_STRING, &f->outside, N_("Outside design temperature, °C"), "T" },
    { "ground-area", 0, 0, G_OPTION_ARG_STRING, &f->ground_area, N_("Ground floor area A, m² (EN ISO 13370)"), "M2" },
    { "ground-perimeter", 0, 0, G_OPTION_ARG_STRING, &f->ground_perimeter, N_("Exposed perimeter P, m (EN ISO 13370)"), "M" },
    { "ground-b-prime", 0, 0, G_OPTION_ARG_STRING, &f->ground_b_prime, N_("Characteristic dimension B′, m (EN ISO 13370)"), "M" },
    { NULL }
  };

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
}

static void
replace_text (char       **field,
              const char  *value)
{
  if (value == NULL)
    return;
  g_free (*field);
  *field = value[0] != '\0' ? g_strdup (value) : NULL;
}

/* Applies the given fields to @job; FALSE after a message. */
static gboolean
apply_fields (const JobFields *f,
              LaminaJob       *job)
{
  if (f->name != NULL && f->name[0] == '\0')
    {
      lamina_cli_error (_("--name: a job needs a name"));
      return FALSE;
    }
  replace_text (&job->name, f->name);
  replace_text (&job->number, f->number);
  replace_text (&job->client, f->client);
  replace_text (&job->site, f->site);
  replace_text (&job->architect, f->architect);
  replace_text (&job->target_set, f->targets);
  replace_text (&job->climate, f->climate);
  if (f->status != NULL && !lamina_job_status_from_string (f->status, &job->status))
    {
      lamina_cli_error (_("--status: “%s” is not one of design, submitted, built"), f->status);
      return FALSE;
    }
  return lamina_cli_parse_number ("--inside-temperature", f->inside, -80, 80, &job->inside_temperature)
         && lamina_cli_parse_number ("--outside-temperature", f->outside, -80, 80, &job->outside_temperature)
         && lamina_cli_parse_number ("--ground-area", f->ground_area, 0.001, 1e6, &job->ground_area)
         && lamina_cli_parse_number ("--ground-perimeter", f->ground_perimeter, 0.001, 1e6, &job->ground_perimeter)
         && lamina_cli_parse_number ("--ground-b-prime", f->ground_b_prime, 0.001, 1e6, &job->ground_b_prime);
}

static gboolean
parse_args (GOptionContext *context,
            int            *argc,
            char         ***argv,
            int             n_args,
            const char     *usage)
{
  if (!lamina_cli_parse (context, argc, argv))
    return FALSE;
  if (*argc != n_args)
    {
      lamina_cli_error ("%s", usage);
      return FALSE;
    }
  return TRUE;
}

static int
report_error (GError *error)
{
  lamina_cli_error ("%s", error->message);
  return LAMINA_EXIT_BAD_INPUT;
}

const char *
lamina_cli_job_key_help (void)
{
  return _("JOB is a job's id or its job number (ASCII letters without case). An id is taken "
           "first, but a text that is one job's id and another job's number is refused, naming "
           "both.");
}

char *
lamina_cli_job_resolve (LaminaLibrary *library,
                        const char    *key)
{
  g_autoptr(GError) error = NULL;
  char *id = lamina_library_dup_job_id (library, key, &error);

  if (id == NULL)
    lamina_cli_error ("%s: %s", lamina_library_get_path (library), error->message);
  return id;
}

/* Opens the library and reads the job that @key names; FALSE after a
 * message (@library may then be set, for the caller to free). */
static gboolean
open_job (const LaminaCliGlobals  *globals,
          const char              *key,
          LaminaLibrary          **library,
          LaminaJob              **job)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *id = NULL;

  *library = lamina_cli_open_library (globals, FALSE);
  if (*library == NULL || (id = lamina_cli_job_resolve (*library, key)) == NULL)
    return FALSE;
  *job = lamina_library_dup_job (*library, id, &error);
  if (*job == NULL)
    report_error (error);
  return *job != NULL;
}

/* A job command's context: its summary and how JOB is read. */
static GOptionContext *
job_context_new (const char *parameter)
{
  GOptionContext *context = g_option_context_new (parameter);

  g_option_context_set_description (context, lamina_cli_job_key_help ());
  return context;
}

/* job new JOB --name NAME [--number N] [--client C] [--targets SET] … */
int
lamina_cli_job_new (const LaminaCliGlobals *globals,
                    int                     argc,
                    char                  **argv)
{
  g_auto(JobFields) f = { 0 };
  g_autoptr(GOptionContext) context = g_option_context_new (_("JOB — start a job"));
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(LaminaJob) job = NULL;
  g_autoptr(GError) error = NULL;

  add_field_entries (context, &f);
  if (!parse_args (context, &argc, &argv, 2, _("job new takes one job id (see “lamina-cli job new --help”)")))
    return LAMINA_EXIT_USAGE;
  if (f.name == NULL)
    {
      lamina_cli_error (_("job new needs --name"));
      return LAMINA_EXIT_USAGE;
    }
  job = lamina_job_new (argv[1], f.name);
  if (!apply_fields (&f, job))
    return LAMINA_EXIT_USAGE;
  library = lamina_cli_open_library (globals, FALSE);
  if (library == NULL)
    return LAMINA_EXIT_BAD_INPUT;
  if (!lamina_library_create_job (library, job, &error))
    return report_error (error);
  printf (_("job “%s” created\n"), job->id);
  return LAMINA_EXIT_OK;
}

/* Pins @key (or a variant of it) on @job; FALSE after a message. */
static gboolean
add_construction (LaminaLibrary *library,
                  LaminaJob     *job,
                  const char    *key,
                  const char    *use,
                  int            revision,
                  gboolean       variant,
                  LaminaJobEntry **added)
{
  g_autofree char *id = lamina_cli_resolve_id (library, key);
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaJobEntry) e = NULL;
  gboolean approved = FALSE;

  if (id == NULL)
    return FALSE;
  revision = lamina_library_pick_revision (library, id, revision, &approved, &error);
  if (revision == 0)
    {
      report_error (error);
      return FALSE;
    }
  e = lamina_job_entry_new (id, revision, use);
  if (variant)
    {
      g_autofree char *copy = lamina_library_derive_job_variant (library, id, revision, job->name, NULL, &error);

      if (copy == NULL)
        {
          report_error (error);
          return FALSE;
        }
      e->origin = g_steal_pointer (&e->construction);
      e->origin_revision = revision;
      e->construction = g_steal_pointer (&copy);
      e->revision = 1;
      approved = FALSE;
    }
  if (!approved)
    fprintf (stderr, _("lamina-cli: note: “%s” revision %d is not approved\n"), e->construction,
             e->revision);
  *added = lamina_job_add_entry (job, g_steal_pointer (&e));
  return TRUE;
}

/* job add JOB CONSTRUCTION --use USE [--area M2] [--revision N] [--location TEXT] [--variant]
 * job add JOB --junction NAME --psi W/(m·K) --length M */
int
lamina_cli_job_add (const LaminaCliGlobals *globals,
                    int                     argc,
                    char                  **argv)
{
  g_autofree char *use = NULL, *area = NULL, *revision_text = NULL, *location = NULL;
  g_autofree char *junction = NULL, *psi = NULL, *length = NULL;
  gboolean variant = FALSE;
  const GOptionEntry entries[] = {
    { "use", 0, 0, G_OPTION_ARG_STRING, &use, N_("The use in the job's target set (external-wall …)"), "USE" },
    { "area", 0, 0, G_OPTION_ARG_STRING, &area, N_("Area in m²"), "M2" },
    { "revision", 0, 0, G_OPTION_ARG_STRING, &revision_text, N_("Pin this revision (default: the latest approved, else the latest)"), "N" },
    { "location", 0, 0, G_OPTION_ARG_STRING, &location, N_("Where in the building"), "TEXT" },
    { "variant", 0, 0, G_OPTION_ARG_NONE, &variant, N_("Derive a job variant of the construction and pin it"), NULL },
    { "junction", 0, 0, G_OPTION_ARG_STRING, &junction, N_("Add a linear thermal bridge entered by hand"), "NAME" },
    { "psi", 0, 0, G_OPTION_ARG_STRING, &psi, N_("Its ψ, W/(m·K)"), "X" },
    { "length", 0, 0, G_OPTION_ARG_STRING, &length, N_("Its length, m"), "M" },
    { NULL }
  };
  g_autoptr(GOptionContext) context = job_context_new (_("JOB CONSTRUCTION — add an entry to a job's schedule"));
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(LaminaJob) job = NULL;
  g_autoptr(GError) error = NULL;
  LaminaJobEntry *e = NULL;
  int revision = 0;
  double a = NAN, p = NAN, l = NAN;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (argc != (junction != NULL ? 2 : 3))
    {
      lamina_cli_error (junction != NULL
                        ? _("job add --junction takes a job id only (see “lamina-cli job add --help”)")
                        : _("job add takes a job id and a construction, or a --junction "
                            "(see “lamina-cli job add --help”)"));
      return LAMINA_EXIT_USAGE;
    }
  if (junction == NULL && use == NULL)
    {
      lamina_cli_error (_("job add needs --use"));
      return LAMINA_EXIT_USAGE;
    }
  if (junction != NULL && (psi == NULL || length == NULL))
    {
      lamina_cli_error (_("job add --junction needs --psi and --length"));
      return LAMINA_EXIT_USAGE;
    }
  if (!lamina_cli_parse_revision (revision_text, &revision)
      || !lamina_cli_parse_number ("--area", area, 0, 1e6, &a)
      || !lamina_cli_parse_number ("--psi", psi, -10, 10, &p)
      || !lamina_cli_parse_number ("--length", length, 0, 1e5, &l))
    return LAMINA_EXIT_USAGE;
  if (!open_job (globals, argv[1], &library, &job))
    return LAMINA_EXIT_BAD_INPUT;
  if (junction != NULL)
    {
      LaminaJobJunction *j = lamina_job_add_junction (job, lamina_job_junction_new (junction, p, l));

      if (!lamina_library_save_job (library, job, &error))
        return report_error (error);
      printf (_("job “%s”: junction %d added\n"), job->id, j->n);
      return LAMINA_EXIT_OK;
    }
  if (!add_construction (library, job, argv[2], use, revision, variant, &e))
    return LAMINA_EXIT_BAD_INPUT;
  e->area = a;
  e->location = g_strdup (location);
  if (!lamina_library_save_job (library, job, &error))
    return report_error (error);
  printf (_("job “%s”: entry %d pins “%s” revision %d\n"), job->id, e->n, e->construction,
          e->revision);
  return LAMINA_EXIT_OK;
}

static gboolean
parse_entry_number (const char *text,
                    int        *n)
{
  guint64 v;

  if (!g_ascii_string_to_unsigned (text, 10, 1, G_MAXINT, &v, NULL))
    {
      lamina_cli_error (_("“%s” is not an entry number (see “lamina-cli job show”)"), text);
      return FALSE;
    }
  *n = (int) v;
  return TRUE;
}

/* job remove JOB ENTRY [--junction] */
int
lamina_cli_job_remove (const LaminaCliGlobals *globals,
                       int                     argc,
                       char                  **argv)
{
  gboolean junction = FALSE;
  const GOptionEntry entries[] = {
    { "junction", 0, 0, G_OPTION_ARG_NONE, &junction, N_("ENTRY is a junction's number"), NULL },
    { NULL }
  };
  g_autoptr(GOptionContext) context = job_context_new (_("JOB ENTRY — remove an entry from a job's schedule"));
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(LaminaJob) job = NULL;
  g_autoptr(GError) error = NULL;
  int n = 0;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!parse_args (context, &argc, &argv, 3,
                   _("job remove takes a job id and an entry number (see “lamina-cli job remove --help”)"))
      || !parse_entry_number (argv[2], &n))
    return LAMINA_EXIT_USAGE;
  if (!open_job (globals, argv[1], &library, &job))
    return LAMINA_EXIT_BAD_INPUT;
  if (!(junction ? lamina_job_remove_junction (job, n) : lamina_job_remove_entry (job, n)))
    {
      lamina_cli_error (_("job “%s” has no %s %d"), job->id, junction ? _("junction") : _("entry"), n);
      return LAMINA_EXIT_BAD_INPUT;
    }
  if (!lamina_library_save_job (library, job, &error))
    return report_error (error);
  printf (_("job “%s”: %s %d removed\n"), job->id, junction ? _("junction") : _("entry"), n);
  return LAMINA_EXIT_OK;
}

/* job update JOB [--name …] [--move ENTRY [--revision N] [--by NAME]]
 *                [--entry ENTRY --area M2 | --location TEXT | --use USE] */
int
lamina_cli_job_update (const LaminaCliGlobals *globals,
                       int                     argc,
                       char                  **argv)
{
  g_auto(JobFields) f = { 0 };
  g_autofree char *move = NULL, *entry_text = NULL, *revision_text = NULL, *by = NULL;
  g_autofree char *area = NULL, *location = NULL, *use = NULL;
  const GOptionEntry entries[] = {
    { "move", 0, 0, G_OPTION_ARG_STRING, &move, N_("Move this entry to --revision (default: the newest approved); recorded"), "ENTRY" },
    { "revision", 0, 0, G_OPTION_ARG_STRING, &revision_text, N_("The revision to move to"), "N" },
    { "by", 0, 0, G_OPTION_ARG_STRING, &by, N_("Who moves it (default: the user)"), "NAME" },
    { "entry", 0, 0, G_OPTION_ARG_STRING, &entry_text, N_("Change this entry's --area, --location or --use"), "ENTRY" },
    { "area", 0, 0, G_OPTION_ARG_STRING, &area, N_("The entry's area in m² (\"\" for none)"), "M2" },
    { "location", 0, 0, G_OPTION_ARG_STRING, &location, N_("The entry's location"), "TEXT" },
    { "use", 0, 0, G_OPTION_ARG_STRING, &use, N_("The entry's use"), "USE" },
    { NULL }
  };
  g_autoptr(GOptionContext) context = job_context_new (_("JOB — change a job's data, move or change an entry"));
  g_autoptr(LaminaLibrary) library = NULL;
  g_autofree char *id = NULL;
  g_autoptr(LaminaJob) job = NULL;
  g_autoptr(GError) error = NULL;
  int n = 0, revision = 0;
  LaminaJobEntry *e = NULL;

  add_field_entries (context, &f);
  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!parse_args (context, &argc, &argv, 2, _("job update takes one job id (see “lamina-cli job update --help”)"))
      || (move != NULL && !parse_entry_number (move, &n))
      || (entry_text != NULL && !parse_entry_number (entry_text, &n))
      || !lamina_cli_parse_revision (revision_text, &revision))
    return LAMINA_EXIT_USAGE;
  if (move != NULL && entry_text != NULL)
    {
      lamina_cli_error (_("job update: --move and --entry one at a time"));
      return LAMINA_EXIT_USAGE;
    }
  library = lamina_cli_open_library (globals, FALSE);
  if (library == NULL || (id = lamina_cli_job_resolve (library, argv[1])) == NULL)
    return LAMINA_EXIT_BAD_INPUT;
  if (move != NULL && !lamina_library_move_job_entry (library, id, n, revision, by, &error))
    return report_error (error);
  job = lamina_library_dup_job (library, id, &error);
  if (job == NULL)
    return report_error (error);
  if (!apply_fields (&f, job))
    return LAMINA_EXIT_USAGE;
  if (entry_text != NULL && (e = lamina_job_find_entry (job, n)) == NULL)
    {
      lamina_cli_error (_("job “%s” has no entry %d"), job->id, n);
      return LAMINA_EXIT_BAD_INPUT;
    }
  if (e != NULL && area != NULL && area[0] == '\0')
    e->area = NAN;
  else if (e != NULL && !lamina_cli_parse_number ("--area", area, 0, 1e6, &e->area))
    return LAMINA_EXIT_USAGE;
  if (e != NULL)
    {
      replace_text (&e->location, location);
      if (use != NULL && use[0] != '\0')
        replace_text (&e->use, use);
    }
  if (!lamina_library_save_job (library, job, &error))
    return report_error (error);
  printf (_("job “%s” updated\n"), job->id);
  return LAMINA_EXIT_OK;
}

/* Asks on the terminal: a job in design takes y; a job submitted or
 * built (its sheets may be with building control or on site) only its
 * job number typed in full (its id when it has none). */
static gboolean
confirm_delete (const LaminaJob *job)
{
  const char *key = job->number ? job->number : job->id;
  char answer[256] = "";
  guint n = job->entries->len;

  if (job->status == LAMINA_JOB_STATUS_DESIGN)
    fprintf (stderr, g_dngettext (GETTEXT_PACKAGE,
                                  "Delete the job “%s” (%s) with its schedule of %u entry? "
                                  "The library's constructions stay. [y/N] ",
                                  "Delete the job “%s” (%s) with its schedule of %u entries? "
                                  "The library's constructions stay. [y/N] ", n),
             job->id, job->name, n);
  else
    fprintf (stderr, g_dngettext (GETTEXT_PACKAGE,
                                  "The job “%s” (%s) is %s: its sheets may have been issued. To delete "
                                  "it with its schedule of %u entry, type “%s”: ",
                                  "The job “%s” (%s) is %s: its sheets may have been issued. To delete "
                                  "it with its schedule of %u entries, type “%s”: ", n),
             job->id, job->name, lamina_job_status_to_string (job->status), n, key);
  fflush (stderr);
  if (fgets (answer, sizeof answer, stdin) == NULL)
    return FALSE;
  g_strstrip (answer);
  if (job->status == LAMINA_JOB_STATUS_DESIGN)
    return g_ascii_strncasecmp (answer, "y", 1) == 0 || g_ascii_strncasecmp (answer, _("y"), 1) == 0;
  return strcmp (answer, key) == 0;
}

/* job delete JOB [--yes] */
int
lamina_cli_job_delete (const LaminaCliGlobals *globals,
                       int                     argc,
                       char                  **argv)
{
  gboolean yes = FALSE;
  const GOptionEntry entries[] = {
    { "yes", 'y', 0, G_OPTION_ARG_NONE, &yes, N_("Delete without asking (for scripts)"), NULL },
    { NULL }
  };
  g_autoptr(GOptionContext) context = job_context_new (_("JOB — delete a job with its schedule "
                                                         "(the library's constructions stay)"));
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(LaminaJob) job = NULL;
  g_autoptr(GError) error = NULL;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!parse_args (context, &argc, &argv, 2, _("job delete takes one job (see “lamina-cli job delete --help”)")))
    return LAMINA_EXIT_USAGE;
  if (!open_job (globals, argv[1], &library, &job))
    return LAMINA_EXIT_BAD_INPUT;
  if (!yes && !confirm_delete (job))
    {
      lamina_cli_error (_("job “%s” not deleted: no confirmation (“--yes” deletes without asking)"), job->id);
      return LAMINA_EXIT_BAD_INPUT;
    }
  if (!lamina_library_delete_job (library, job->id, &error))
    return report_error (error);
  printf (g_dngettext (GETTEXT_PACKAGE, "job “%s” deleted with its schedule of %u entry\n",
                       "job “%s” deleted with its schedule of %u entries\n", job->entries->len),
          job->id, job->entries->len);
  return LAMINA_EXIT_OK;
}

static const struct
{
  const char       *name;
  LaminaCliJobFunc  func;
  const char       *summary;
} subcommands[] = {
  { "new", lamina_cli_job_new, N_("Start a job (name, number, client, targets …)") },
  { "list", lamina_cli_job_list, N_("The jobs of the library") },
  { "show", lamina_cli_job_show, N_("A job's data, schedule and check against its targets") },
  { "add", lamina_cli_job_add, N_("Pin a construction (or a junction) in a job's schedule") },
  { "remove", lamina_cli_job_remove, N_("Remove an entry from a job's schedule") },
  { "update", lamina_cli_job_update, N_("Change a job's data; move an entry to another revision") },
  { "sheets", lamina_cli_job_sheets, N_("Print a job's sheet set to one PDF") },
  { "delete", lamina_cli_job_delete, N_("Delete a job with its schedule (asks first)") },
};

/* job SUBCOMMAND … */
int
lamina_cli_job (const LaminaCliGlobals *globals,
                int                     argc,
                char                  **argv)
{
  if (argc >= 2)
    for (guint i = 0; i < G_N_ELEMENTS (subcommands); i++)
      if (strcmp (argv[1], subcommands[i].name) == 0)
        return subcommands[i].func (globals, argc - 1, argv + 1);
  if (argc >= 2 && strcmp (argv[1], "--help") != 0 && strcmp (argv[1], "-h") != 0)
    lamina_cli_error (_("unknown job command “%s”"), argv[1]);
  fprintf (argc >= 2 && argv[1][0] != '-' ? stderr : stdout, "%s\n",
           _("Usage: lamina-cli job COMMAND [OPTIONS…]"));
  for (guint i = 0; i < G_N_ELEMENTS (subcommands); i++)
    fprintf (stdout, "  %-8s %s\n", subcommands[i].name, _(subcommands[i].summary));
  fprintf (stdout, "\n%s\n", lamina_cli_job_key_help ());
  return argc >= 2 && (strcmp (argv[1], "--help") == 0 || strcmp (argv[1], "-h") == 0)
         ? LAMINA_EXIT_OK : LAMINA_EXIT_USAGE;
}
