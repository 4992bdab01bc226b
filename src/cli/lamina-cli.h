/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli.h: the commands of lamina-cli.  Each command lives in its own
 * file and is listed in the table in lamina-cli.c. */
#pragma once

#include <glib.h>
#include <stdio.h>

G_BEGIN_DECLS

/* Exit codes of every command. */
enum
{
  LAMINA_EXIT_OK = 0,
  LAMINA_EXIT_BAD_INPUT = 1, /* message on stderr naming file:line or field */
  LAMINA_EXIT_USAGE = 2,
};

typedef struct
{
  const char *library_path;  /* --library, or NULL for the default */
  gboolean    force;         /* --force: overwrite existing output files */
} LaminaCliGlobals;

/* argv[0] is the command name; options after it are the command's. */
typedef int (*LaminaCliFunc) (const LaminaCliGlobals *globals,
                              int                     argc,
                              char                  **argv);

int  lamina_cli_calc    (const LaminaCliGlobals *globals,
                         int                     argc,
                         char                  **argv);
int  lamina_cli_moisture (const LaminaCliGlobals *globals,
                          int                     argc,
                          char                  **argv);

/* The office library (lamina-cli-library.c, lamina-cli-library-exchange.c). */
int  lamina_cli_list      (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_show      (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_import    (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_export    (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_approve   (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_check     (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_history   (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_materials (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_demo      (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_section   (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_sheet     (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_catalogue (const LaminaCliGlobals *globals, int argc, char **argv);
/* lamina-cli-review.c */
int  lamina_cli_policy    (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_withdraw  (const LaminaCliGlobals *globals, int argc, char **argv);
/* lamina-cli-moisture-limit.c */
int  lamina_cli_moisture_limit (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_solve     (const LaminaCliGlobals *globals, int argc, char **argv);
/* Jobs (lamina-cli-job.c, lamina-cli-job-show.c). */
int  lamina_cli_job       (const LaminaCliGlobals *globals, int argc, char **argv);
/* The 2-D check (lamina-cli-field.c). */
int  lamina_cli_field     (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_compare   (const LaminaCliGlobals *globals, int argc, char **argv);
/* lamina-cli-copy.c */
int  lamina_cli_copy      (const LaminaCliGlobals *globals, int argc, char **argv);
/* Library safety (lamina-cli-safety.c). */
int  lamina_cli_verify    (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_backup    (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_restore   (const LaminaCliGlobals *globals, int argc, char **argv);
/* lamina-cli-server.c */
int  lamina_cli_server_init (const LaminaCliGlobals *globals, int argc, char **argv);

/* Where to say what was written: stdout, or stderr when the output
 * itself goes to stdout ("-o -"). */
FILE *lamina_cli_message_stream (const char *output);
/* Prints "lamina-cli: message" on stderr. */
void lamina_cli_error   (const char *format,
                         ...) G_GNUC_PRINTF (1, 2);
/* Parses the command's options; on failure prints the error and returns
 * FALSE (the caller exits LAMINA_EXIT_USAGE). */
gboolean lamina_cli_parse (GOptionContext *context,
                           int            *argc,
                           char         ***argv);

G_END_DECLS
