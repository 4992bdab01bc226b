/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cairo-output.c: see lamina-cairo-output.h. */
#define G_LOG_DOMAIN "lamina-sheet"

#include "lamina-cairo-output.h"
#include "lamina-sheet.h"

cairo_status_t
lamina_cairo_output_write_cb (void                *closure,
                              const unsigned char *data,
                              unsigned int         length)
{
  /* The writer keeps the first failure (with its errno) and drops what
   * follows; cairo is told all is well, because cairo 1.16's PDF surface
   * crashes in cairo_surface_finish after a write error early in the
   * document (seen writing to /dev/full). */
  lamina_file_writer_write (closure, data, length);
  return CAIRO_STATUS_SUCCESS;
}

static gboolean
propagate (GError  **error,
           GError   *local)
{
  int code = g_error_matches (local, LAMINA_FILE_ERROR, LAMINA_FILE_ERROR_EXISTS)
    ? LAMINA_SHEET_ERROR_EXISTS : LAMINA_SHEET_ERROR_IO;

  g_set_error_literal (error, LAMINA_SHEET_ERROR, code, local->message);
  g_error_free (local);
  return FALSE;
}

LaminaFileWriter *
lamina_cairo_output_open (const char *path,
                          gboolean    overwrite,
                          GError    **error)
{
  GError *local = NULL;
  LaminaFileWriter *writer = lamina_file_writer_open (path, overwrite, &local);

  if (writer == NULL)
    propagate (error, local);
  return writer;
}

gboolean
lamina_cairo_output_close (LaminaFileWriter *writer,
                           gboolean          ok,
                           cairo_status_t    status,
                           GError          **error)
{
  GError *local = NULL;

  if (!ok)
    {
      lamina_file_writer_abort (writer);
      return FALSE;
    }
  /* A write error inside cairo is kept by the writer with its errno,
   * which says more than cairo's "error while writing to output stream". */
  if (status != CAIRO_STATUS_SUCCESS)
    lamina_file_writer_fail (writer, cairo_status_to_string (status));
  if (!lamina_file_writer_commit (writer, &local))
    return propagate (error, local);
  return TRUE;
}
