/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-file.h: the one way Lamina writes a user's file (sheets,
 * catalogues, section images, exports) and reads a document.
 *
 * Writing a regular file: a temporary file beside the target, named
 * ".NAME.lamina-PID-XXXXXX", every write checked, fsync'd, then renamed
 * over the target (or linked, when overwriting is off, so that a file that
 * appeared meanwhile is not replaced).  On any failure the old file is
 * untouched, the temporary file is removed and the error names the user's
 * path.  Temporary files of our naming whose process is gone (a writer
 * killed by SIGKILL) are removed the next time the folder is written to.
 * A symbolic link stays a link: the file it points to is replaced.  A
 * FIFO or character device is written in place (never replaced by a
 * regular file), and "-" is standard output. */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

#define LAMINA_FILE_ERROR (lamina_file_error_quark ())
typedef enum
{
  LAMINA_FILE_ERROR_IO,       /* cannot read or write */
  LAMINA_FILE_ERROR_EXISTS,   /* the target exists and overwriting is off */
  LAMINA_FILE_ERROR_KIND,     /* a folder, block device or socket */
  LAMINA_FILE_ERROR_TOO_BIG,  /* a document over the read limit */
} LaminaFileError;
GQuark lamina_file_error_quark (void);

typedef struct _LaminaFileWriter LaminaFileWriter;

/* Refuses early what lamina_file_writer_open() would refuse: an existing
 * regular file when @overwrite is off, a folder, a block device. */
gboolean          lamina_file_check_target   (const char        *path,
                                              gboolean           overwrite,
                                              GError           **error);
LaminaFileWriter *lamina_file_writer_open    (const char        *path,
                                              gboolean           overwrite,
                                              GError           **error);
/* FALSE once a write has failed; the failure is reported by _commit(). */
gboolean          lamina_file_writer_write   (LaminaFileWriter  *writer,
                                              const void        *data,
                                              gsize              length);
/* TRUE once a write has failed or _fail() was called: a producer of
 * many pages can stop early. */
gboolean          lamina_file_writer_failed  (LaminaFileWriter  *writer);
/* Marks the output as failed for a reason found by the producer (a cairo
 * status, say); _commit() then reports it and keeps the old file. */
void              lamina_file_writer_fail    (LaminaFileWriter  *writer,
                                              const char        *reason);
/* Syncs and moves the file into place; frees @writer in every case. */
gboolean          lamina_file_writer_commit  (LaminaFileWriter  *writer,
                                              GError           **error);
/* Drops the output (the old file stays); frees @writer. */
void              lamina_file_writer_abort   (LaminaFileWriter  *writer);
/* The path as the user gave it. */
const char       *lamina_file_writer_get_path (LaminaFileWriter *writer);

/* The whole of @data, through a writer. */
gboolean          lamina_file_write_contents (const char        *path,
                                              gboolean           overwrite,
                                              const void        *data,
                                              gsize              length,
                                              GError           **error);

/* Reads at most @limit bytes from a file, pipe or device: a longer input
 * is refused with LAMINA_FILE_ERROR_TOO_BIG instead of growing without
 * bound (/dev/zero).  The result is NUL-terminated. */
char             *lamina_file_read_limited   (const char        *path,
                                              gsize              limit,
                                              gsize             *length,
                                              GError           **error);

G_END_DECLS
