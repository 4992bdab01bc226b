/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli-library.h: helpers shared by the library commands. */
#pragma once

#include <json-glib/json-glib.h>

#include "lamina-cli.h"
#include "lamina-library.h"

G_BEGIN_DECLS

/* Opens --library (which must exist unless @create) or the default
 * library; prints the error and returns NULL on failure. */
LaminaLibrary *lamina_cli_open_library (const LaminaCliGlobals *globals,
                                        gboolean                create);
/* The start every listing command shares: an option --json (described
 * by @json_help), exactly @n_args arguments after the command (else
 * @wrong_args is printed and *exit_code is LAMINA_EXIT_USAGE), then the
 * library, which must exist.  NULL with *exit_code set when the command
 * cannot go on. */
LaminaLibrary *lamina_cli_open_listing (const LaminaCliGlobals *globals,
                                        const char             *parameter_string,
                                        const char             *json_help,
                                        int                     n_args,
                                        const char             *wrong_args,
                                        int                    *argc,
                                        char                 ***argv,
                                        gboolean               *json,
                                        int                    *exit_code);
/* lamina-cli-safety.c: what every command does with a library it has
 * opened: says on stderr when a write waits for another program, and
 * makes the day's backup (a failure is a warning, not the command's). */
void           lamina_cli_library_opened (LaminaLibrary        *library);

/* An id, or an office code that names exactly one construction. */
char          *lamina_cli_resolve_id   (LaminaLibrary          *library,
                                        const char             *key);
/* Prints @root (taken) as indented JSON on stdout. */
void           lamina_cli_print_json   (JsonNode               *root);

/* --revision N: 1 … G_MAXINT; @text NULL leaves @revision.  FALSE after
 * printing a message that names the option and the range. */
gboolean       lamina_cli_parse_revision (const char           *text,
                                          int                  *revision);

/* --status in any case ("Approved"); FALSE after printing a message that
 * names the option and the allowed values. */
gboolean       lamina_cli_parse_status   (const char           *text,
                                          LaminaStatus         *status);

/* lamina-cli-review.c: the review records of @revision, indented under
 * its history line; and all of them as the "reviews" member of @b. */
void           lamina_cli_print_review_events   (GPtrArray   *events,
                                                 int          revision);
void           lamina_cli_review_events_to_json (JsonBuilder *b,
                                                 GPtrArray   *events);

G_END_DECLS
