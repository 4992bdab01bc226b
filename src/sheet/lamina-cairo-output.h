/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cairo-output.h: cairo streams (PDF, PNG) into a LaminaFileWriter,
 * with the surface's finish status checked before the file is committed. */
#pragma once

#include <cairo.h>
#include <glib.h>

#include "lamina-file.h"

G_BEGIN_DECLS

/* A cairo_write_func_t whose closure is a LaminaFileWriter.  A failed
 * write is reported by lamina_cairo_output_close(), not to cairo. */
cairo_status_t lamina_cairo_output_write_cb (void                *closure,
                                             const unsigned char *data,
                                             unsigned int         length);
/* Checks @status (of cairo_surface_finish or a PNG stream), then commits
 * @writer, or drops it when @ok is FALSE (the caller's @error is set
 * already) or cairo failed.  Frees @writer.  Errors are in
 * LAMINA_SHEET_ERROR and name the user's path. */
gboolean       lamina_cairo_output_close    (LaminaFileWriter    *writer,
                                             gboolean             ok,
                                             cairo_status_t       status,
                                             GError             **error);
/* Opens a writer with errors in LAMINA_SHEET_ERROR. */
LaminaFileWriter *lamina_cairo_output_open  (const char          *path,
                                             gboolean             overwrite,
                                             GError             **error);

G_END_DECLS
