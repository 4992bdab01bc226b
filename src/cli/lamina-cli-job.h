/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli-job.h: the subcommands of `lamina-cli job`. */
#pragma once

#include "lamina-cli-library.h"

G_BEGIN_DECLS

typedef int (*LaminaCliJobFunc) (const LaminaCliGlobals *globals,
                                 int                     argc,
                                 char                  **argv);

/* lamina-cli-job.c */
int  lamina_cli_job_new    (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_job_add    (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_job_remove (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_job_update (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_job_delete (const LaminaCliGlobals *globals, int argc, char **argv);
/* lamina-cli-job-show.c */
int  lamina_cli_job_list   (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_job_show   (const LaminaCliGlobals *globals, int argc, char **argv);
int  lamina_cli_job_sheets (const LaminaCliGlobals *globals, int argc, char **argv);

/* A number option within [@min, @max]; @text NULL leaves @value.  FALSE
 * after a message naming the option and the range. */
gboolean lamina_cli_parse_number (const char *option,
                                  const char *text,
                                  double      min,
                                  double      max,
                                  double     *value);

/* The id of the job @key names (its id or its job number, as
 * lamina_library_dup_job_id); NULL after a message. */
char    *lamina_cli_job_resolve  (LaminaLibrary *library,
                                  const char    *key);
/* How JOB is read, as the --help of a job command says it. */
const char *lamina_cli_job_key_help (void);

G_END_DECLS
