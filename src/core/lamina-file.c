/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-file.c: whole files or none (see lamina-file.h).  POSIX only:
 * open/write/fsync/rename/link, the calls whose every failure a disk that
 * fills up or a network share can produce. */
#define G_LOG_DOMAIN "lamina-core"

#include "config.h"

#include "lamina-file.h"

#include <errno.h>
#include <fcntl.h>
#include <glib/gi18n-lib.h>
#include <glib/gstdio.h>
#include <signal.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

G_DEFINE_QUARK (lamina-file-error-quark, lamina_file_error)

#define TEMP_MARK ".lamina-"

struct _LaminaFileWriter
{
  char     *path;      /* as the user gave it: every message names it */
  char     *target;    /* what is replaced: @path, or the file a link points to */
  char     *temp;      /* NULL when writing in place (stdout, FIFO, device) */
  int       fd;
  gboolean  overwrite;
  gboolean  close_fd;
  int       saved_errno;
  char     *reason;
};

static gboolean
set_errno_error (GError    **error,
                 const char *path,
                 int         saved_errno)
{
  g_set_error (error, LAMINA_FILE_ERROR, LAMINA_FILE_ERROR_IO, "%s: %s", path, g_strerror (saved_errno));
  return FALSE;
}

static gboolean
set_exists_error (GError    **error,
                  const char *path)
{
  g_set_error (error, LAMINA_FILE_ERROR, LAMINA_FILE_ERROR_EXISTS,
               _("%s: the file exists (use --force to replace it)"), path);
  return FALSE;
}

/* Follows a chain of symbolic links to the path that is really written;
 * the link itself is never replaced. */
static char *
dup_link_target (const char *path,
                 GError    **error)
{
  g_autofree char *current = g_strdup (path);

  for (int depth = 0; depth < 40; depth++)
    {
      g_autofree char *link = NULL;
      g_autofree char *dir = NULL;
      GStatBuf st;

      if (g_lstat (current, &st) != 0 || !S_ISLNK (st.st_mode))
        return g_steal_pointer (&current);
      link = g_file_read_link (current, NULL);
      if (link == NULL)
        break;
      dir = g_path_get_dirname (current);
      g_free (current);
      current = g_path_is_absolute (link) ? g_steal_pointer (&link) : g_build_filename (dir, link, NULL);
    }
  set_errno_error (error, path, ELOOP);
  return NULL;
}

/* The kind of target @path is: 0 = absent, S_IFREG, S_IFIFO, S_IFCHR;
 * anything else is refused. */
static gboolean
classify (const char *path,
          const char *target,
          gboolean    overwrite,
          mode_t     *kind,
          GError    **error)
{
  GStatBuf st;

  if (g_stat (target, &st) != 0)
    {
      if (errno != ENOENT)
        return set_errno_error (error, path, errno);
      *kind = 0;
      return TRUE;
    }
  *kind = st.st_mode & S_IFMT;
  switch (*kind)
    {
    case S_IFREG:
      if (!overwrite)
        return set_exists_error (error, path);
      return TRUE;
    case S_IFIFO:
    case S_IFCHR:
      return TRUE;
    case S_IFDIR:
      g_set_error (error, LAMINA_FILE_ERROR, LAMINA_FILE_ERROR_KIND, _("%s: is a folder"), path);
      return FALSE;
    default:
      g_set_error (error, LAMINA_FILE_ERROR, LAMINA_FILE_ERROR_KIND,
                   _("%s: not a file, pipe or character device; nothing was written"), path);
      return FALSE;
    }
}

gboolean
lamina_file_check_target (const char *path,
                          gboolean    overwrite,
                          GError    **error)
{
  g_autofree char *target = NULL;
  mode_t kind;

  g_return_val_if_fail (path != NULL, FALSE);

  if (strcmp (path, "-") == 0)
    return TRUE;
  target = dup_link_target (path, error);
  return target != NULL && classify (path, target, overwrite, &kind, error);
}

/* ".NAME.lamina-PID-XXXXXX": the PID of the writer, so that the next
 * run can tell an abandoned temporary file from one being written. */
static gboolean
is_stale_temp (const char *name)
{
  const char *mark = g_strrstr (name, TEMP_MARK);
  const char *p;
  char *end;
  gint64 pid;

  if (name[0] != '.' || mark == NULL || mark == name)
    return FALSE;
  p = mark + strlen (TEMP_MARK);
  pid = g_ascii_strtoll (p, &end, 10);
  if (end == p || *end != '-' || strlen (end + 1) != 6 || pid <= 0 || pid > G_MAXINT)
    return FALSE;
  if (pid == (gint64) getpid ())
    return FALSE;
  return kill ((pid_t) pid, 0) != 0 && errno == ESRCH;
}

static void
remove_stale_temps (const char *dir)
{
  g_autoptr(GDir) d = g_dir_open (dir, 0, NULL);
  const char *name;

  if (d == NULL)
    return;
  while ((name = g_dir_read_name (d)) != NULL)
    {
      g_autofree char *full = NULL;
      GStatBuf st;

      if (!is_stale_temp (name))
        continue;
      full = g_build_filename (dir, name, NULL);
      if (g_lstat (full, &st) == 0 && S_ISREG (st.st_mode))
        g_unlink (full);
    }
}

static void
writer_free (LaminaFileWriter *w)
{
  g_free (w->path);
  g_free (w->target);
  g_free (w->temp);
  g_free (w->reason);
  g_free (w);
}

static gboolean
open_temp (LaminaFileWriter *w,
           gboolean          replacing,
           GError          **error)
{
  g_autofree char *dir = g_path_get_dirname (w->target);
  g_autofree char *base = g_path_get_basename (w->target);
  GStatBuf st;

  remove_stale_temps (dir);
  w->temp = g_strdup_printf ("%s/.%s" TEMP_MARK "%d-XXXXXX", dir, base, (int) getpid ());
  /* 0666 less the umask, as any new file of the user's. */
  w->fd = g_mkstemp_full (w->temp, O_WRONLY | O_CLOEXEC, 0666);
  if (w->fd < 0)
    {
      g_clear_pointer (&w->temp, g_free);
      return set_errno_error (error, w->path, errno);
    }
  /* A replaced file keeps its permissions. */
  if (replacing && g_stat (w->target, &st) == 0)
    (void) fchmod (w->fd, st.st_mode & 07777);
  w->close_fd = TRUE;
  return TRUE;
}

LaminaFileWriter *
lamina_file_writer_open (const char *path,
                         gboolean    overwrite,
                         GError    **error)
{
  LaminaFileWriter *w;
  mode_t kind;

  g_return_val_if_fail (path != NULL, NULL);

  w = g_new0 (LaminaFileWriter, 1);
  w->path = g_strdup (path);
  w->overwrite = overwrite;
  w->fd = -1;
  if (strcmp (path, "-") == 0)
    {
      g_free (w->path);
      w->path = g_strdup (_("standard output"));
      /* What stdio holds must come first. */
      fflush (stdout);
      w->fd = STDOUT_FILENO;
      return w;
    }
  w->target = dup_link_target (path, error);
  if (w->target == NULL || !classify (path, w->target, overwrite, &kind, error))
    {
      writer_free (w);
      return NULL;
    }
  if (kind == S_IFIFO || kind == S_IFCHR)
    {
      /* In place: no O_CREAT, so a device that vanished is not
       * recreated as a file. */
      w->fd = g_open (w->target, O_WRONLY | O_NOCTTY | O_CLOEXEC, 0);
      if (w->fd < 0)
        {
          set_errno_error (error, path, errno);
          writer_free (w);
          return NULL;
        }
      w->close_fd = TRUE;
      return w;
    }
  if (!open_temp (w, kind == S_IFREG, error))
    {
      writer_free (w);
      return NULL;
    }
  return w;
}

gboolean
lamina_file_writer_write (LaminaFileWriter *w,
                          const void       *data,
                          gsize             length)
{
  const char *p = data;

  g_return_val_if_fail (w != NULL, FALSE);

  if (w->saved_errno != 0 || w->reason != NULL)
    return FALSE;
  while (length > 0)
    {
      ssize_t done = write (w->fd, p, MIN (length, (gsize) G_MAXSSIZE));

      if (done < 0 && errno == EINTR)
        continue;
      if (done <= 0)
        {
          w->saved_errno = done < 0 ? errno : EIO;
          return FALSE;
        }
      p += done;
      length -= (gsize) done;
    }
  return TRUE;
}

gboolean
lamina_file_writer_failed (LaminaFileWriter *w)
{
  g_return_val_if_fail (w != NULL, TRUE);
  return w->saved_errno != 0 || w->reason != NULL;
}

void
lamina_file_writer_fail (LaminaFileWriter *w,
                         const char       *reason)
{
  g_return_if_fail (w != NULL && reason != NULL);

  if (w->saved_errno == 0 && w->reason == NULL)
    w->reason = g_strdup (reason);
}

const char *
lamina_file_writer_get_path (LaminaFileWriter *w)
{
  g_return_val_if_fail (w != NULL, NULL);
  return w->path;
}

static gboolean
report_failure (LaminaFileWriter *w,
                GError          **error)
{
  if (w->saved_errno != 0)
    return set_errno_error (error, w->path, w->saved_errno);
  g_set_error (error, LAMINA_FILE_ERROR, LAMINA_FILE_ERROR_IO, "%s: %s", w->path, w->reason);
  return FALSE;
}

/* Pipes, terminals and /dev/null cannot be synced; that is not a failure. */
static gboolean
sync_fd (int fd)
{
  return fsync (fd) == 0 || errno == EINVAL || errno == EROFS || errno == ENOTSUP;
}

static void
sync_folder (const char *path)
{
  g_autofree char *dir = g_path_get_dirname (path);
  int fd = g_open (dir, O_RDONLY | O_DIRECTORY | O_CLOEXEC, 0);

  if (fd >= 0)
    {
      (void) fsync (fd);
      close (fd);
    }
}

/* rename() when overwriting; link() otherwise, which fails if the target
 * appeared meanwhile instead of replacing it. */
static gboolean
move_into_place (LaminaFileWriter *w,
                 GError          **error)
{
  if (w->overwrite)
    {
      if (g_rename (w->temp, w->target) != 0)
        return set_errno_error (error, w->path, errno);
    }
  else if (link (w->temp, w->target) != 0)
    {
      int saved = errno;

      if (saved == EEXIST)
        return set_exists_error (error, w->path);
      /* Some network shares have no hard links. */
      if ((saved != EPERM && saved != ENOSYS && saved != EOPNOTSUPP) ||
          g_file_test (w->target, G_FILE_TEST_EXISTS) || g_rename (w->temp, w->target) != 0)
        return set_errno_error (error, w->path, saved);
    }
  else
    g_unlink (w->temp);
  g_clear_pointer (&w->temp, g_free);
  sync_folder (w->target);
  return TRUE;
}

gboolean
lamina_file_writer_commit (LaminaFileWriter *w,
                           GError          **error)
{
  gboolean ok;

  g_return_val_if_fail (w != NULL, FALSE);

  ok = w->saved_errno == 0 && w->reason == NULL;
  if (!ok)
    report_failure (w, error);
  if (ok && !sync_fd (w->fd))
    ok = set_errno_error (error, w->path, errno);
  if (w->close_fd && close (w->fd) != 0 && ok)
    ok = set_errno_error (error, w->path, errno);
  w->close_fd = FALSE;
  if (ok && w->temp != NULL)
    ok = move_into_place (w, error);
  if (w->temp != NULL)
    g_unlink (w->temp);
  writer_free (w);
  return ok;
}

void
lamina_file_writer_abort (LaminaFileWriter *w)
{
  if (w == NULL)
    return;
  if (w->close_fd)
    close (w->fd);
  if (w->temp != NULL)
    g_unlink (w->temp);
  writer_free (w);
}

gboolean
lamina_file_write_contents (const char *path,
                            gboolean    overwrite,
                            const void *data,
                            gsize       length,
                            GError    **error)
{
  LaminaFileWriter *w = lamina_file_writer_open (path, overwrite, error);

  if (w == NULL)
    return FALSE;
  lamina_file_writer_write (w, data, length);
  return lamina_file_writer_commit (w, error);
}

char *
lamina_file_read_limited (const char *path,
                          gsize       limit,
                          gsize      *length,
                          GError    **error)
{
  g_autoptr(GByteArray) bytes = g_byte_array_new ();
  int fd;

  g_return_val_if_fail (path != NULL, NULL);

  fd = g_open (path, O_RDONLY | O_NOCTTY | O_CLOEXEC, 0);
  if (fd < 0)
    {
      set_errno_error (error, path, errno);
      return NULL;
    }
  for (;;)
    {
      guint8 chunk[65536];
      ssize_t got = read (fd, chunk, sizeof chunk);

      if (got < 0 && errno == EINTR)
        continue;
      if (got < 0)
        {
          int saved = errno;

          close (fd);
          /* EISDIR: reading a folder. */
          set_errno_error (error, path, saved);
          return NULL;
        }
      if (got == 0)
        break;
      if (bytes->len + (gsize) got > limit)
        {
          close (fd);
          g_set_error (error, LAMINA_FILE_ERROR, LAMINA_FILE_ERROR_TOO_BIG,
                       _("%s: the document is larger than %u MiB"),
                       path, (guint) (limit / (1024 * 1024)));
          return NULL;
        }
      g_byte_array_append (bytes, chunk, (guint) got);
    }
  close (fd);
  *length = bytes->len;
  g_byte_array_append (bytes, (const guint8 *) "", 1);
  return (char *) g_byte_array_free (g_steal_pointer (&bytes), FALSE);
}
