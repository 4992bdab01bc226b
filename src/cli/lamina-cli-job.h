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

G_END_DECLS
