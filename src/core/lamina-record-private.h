/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-record-private.h: what the office records of the model (target
 * sets, jobs) share inside src/core. */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* Sets LAMINA_CALC_ERROR_INVALID with the message and @at in *@line (if
 * @line is not NULL); returns FALSE. */
gboolean lamina_refuse_invalid (GError    **error,
                                int        *line,
                                int         at,
                                const char *format,
                                ...) G_GNUC_PRINTF (4, 5);
/* Equal, or both NAN ("not given"). */
gboolean lamina_same_number    (double      a,
                                double      b);

G_END_DECLS
