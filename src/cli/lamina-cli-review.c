/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli policy | withdraw, and the review records under history. */
#define G_LOG_DOMAIN "lamina-cli"

#include "config.h"

#include "lamina-cli.h"
#include "lamina-cli-library.h"
#include "lamina-cli-report.h"

#include <glib/gi18n.h>
#include <stdio.h>
#include <string.h>

void
lamina_cli_print_review_events (GPtrArray *events,
                                int        revision)
{
  for (guint i = 0; i < events->len; i++)
    {
      LaminaReviewEvent *e = events->pdata[i];

      if (e->revision != revision)
        continue;
      if (g_str_equal (e->act, "approved"))
        printf (_("       approved by %s on %s (recorded %s, policy %s)"), e->by, e->date ? e->date : "",
                e->at, e->policy ? e->policy : "four-eyes");
      else if (g_str_equal (e->act, "withdrawn"))
        printf (_("       approval withdrawn by %s at %s"), e->by, e->at);
      else
        printf (_("       checked by %s at %s"), e->by, e->at);
      if (e->reason)
        printf (g_str_equal (e->act, "approved") ? _(" — outside the method's scope, approved because: %s")
                                                 : _(" — reason: %s"), e->reason);
      printf ("\n");
    }
}

void
lamina_cli_review_events_to_json (JsonBuilder *b,
                                  GPtrArray   *events)
{
  json_builder_set_member_name (b, "reviews");
  json_builder_begin_array (b);
  for (guint i = 0; i < events->len; i++)
    {
      LaminaReviewEvent *e = events->pdata[i];

      json_builder_begin_object (b);
      json_builder_set_member_name (b, "revision");
      json_builder_add_int_value (b, e->revision);
      lamina_cli_json_add_string (b, "act", e->act);
      lamina_cli_json_add_string (b, "by", e->by);
      lamina_cli_json_add_string (b, "at", e->at);
      lamina_cli_json_add_string (b, "date", e->date);
      lamina_cli_json_add_string (b, "policy", e->policy);
      lamina_cli_json_add_string (b, "reason", e->reason);
      json_builder_end_object (b);
    }
  json_builder_end_array (b);
}

/* policy [--set four-eyes|single] */
int
lamina_cli_policy (const LaminaCliGlobals *globals,
                   int                     argc,
                   char                  **argv)
{
  g_autofree char *set = NULL;
  const GOptionEntry entries[] = {
    { "set", 0, 0, G_OPTION_ARG_STRING, &set, N_("Set the policy: four-eyes or single"), "POLICY" },
    { NULL }
  };
  g_autoptr(GOptionContext) context = g_option_context_new (_("— the library's review policy"));
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GError) error = NULL;
  LaminaReviewPolicy policy = LAMINA_REVIEW_FOUR_EYES;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (argc != 1)
    {
      lamina_cli_error (_("policy takes no arguments (see “lamina-cli policy --help”)"));
      return LAMINA_EXIT_USAGE;
    }
  if (set != NULL && !lamina_review_policy_from_string (set, &policy))
    {
      lamina_cli_error (_("--set: unknown policy “%s” (four-eyes or single)"), set);
      return LAMINA_EXIT_USAGE;
    }
  library = lamina_cli_open_library (globals, FALSE);
  if (library == NULL)
    return LAMINA_EXIT_BAD_INPUT;
  if (set != NULL && !lamina_library_set_review_policy (library, policy, &error))
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  policy = lamina_library_get_review_policy (library);
  printf ("%s: %s\n", lamina_review_policy_to_string (policy), lamina_review_policy_explain (policy));
  return LAMINA_EXIT_OK;
}

/* withdraw ID --by NAME --reason TEXT [--revision N] */
int
lamina_cli_withdraw (const LaminaCliGlobals *globals,
                     int                     argc,
                     char                  **argv)
{
  g_autofree char *by = NULL, *reason = NULL, *revision_text = NULL, *id = NULL;
  const GOptionEntry entries[] = {
    { "by", 0, 0, G_OPTION_ARG_STRING, &by, N_("Name of the person withdrawing (required)"), "NAME" },
    { "reason", 0, 0, G_OPTION_ARG_STRING, &reason, N_("Why the approval is withdrawn (required, recorded)"), "TEXT" },
    { "revision", 0, 0, G_OPTION_ARG_STRING, &revision_text, N_("The approved revision (default: the latest)"), "N" },
    { NULL }
  };
  g_autoptr(GOptionContext) context = g_option_context_new (_("ID --by NAME --reason TEXT — withdraw an approval"));
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GError) error = NULL;
  int revision = 0;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (argc != 2 || by == NULL || reason == NULL)
    {
      lamina_cli_error (_("withdraw takes one construction id, --by NAME and --reason TEXT"));
      return LAMINA_EXIT_USAGE;
    }
  if (!lamina_cli_parse_revision (revision_text, &revision))
    return LAMINA_EXIT_USAGE;
  library = lamina_cli_open_library (globals, FALSE);
  if (library == NULL || (id = lamina_cli_resolve_id (library, argv[1])) == NULL)
    return LAMINA_EXIT_BAD_INPUT;
  if (!lamina_library_withdraw_approval (library, id, revision, by, reason, &error))
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  printf (_("%s: approval withdrawn by %s (%s)\n"), argv[1], by, reason);
  return LAMINA_EXIT_OK;
}
