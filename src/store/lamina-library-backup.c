/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-library-backup.c: the rolling copies of a library (see
 * lamina-library-safety.h): where they go, the day's copy, how many are
 * kept, and bringing one back. */
#define G_LOG_DOMAIN "lamina-store"

#include "config.h"

#include "lamina-library-safety.h"

#include <errno.h>
#include <fcntl.h>
#include <signal.h>
#include <stdlib.h>
#include <glib/gstdio.h>
#include <string.h>
#include <unistd.h>

#include "lamina-library-backend.h"

#define SETTING_FOLDER "backup-folder"
#define SETTING_KEEP   "backup-keep"

/* "office" for office.sqlite, and for a server library the database's
 * name (lamina_pg_dup_backup_stem). */
static char *
stem_of (const char *library_path)
{
  char *base;

  if (lamina_library_is_server_address (library_path))
    return lamina_pg_dup_backup_stem (library_path);
  base = g_path_get_basename (library_path);

  if (g_str_has_suffix (base, ".sqlite") && strlen (base) > strlen (".sqlite"))
    base[strlen (base) - strlen (".sqlite")] = '\0';
  return base;
}

static char *
absolute (const char *path)
{
  return g_path_is_absolute (path) ? g_strdup (path) : g_canonicalize_filename (path, NULL);
}

/* The folder without the library's own setting. */
char *
lamina_backup_dup_dir_for_path (const char *path)
{
  const char *env = g_getenv ("LAMINA_BACKUP_DIR");
  g_autofree char *library = lamina_library_is_server_address (path) ? g_strdup (path)
                                                                      : absolute (path);
  g_autofree char *beside = g_strconcat (library, ".backups", NULL);
  g_autofree char *dir = g_path_get_dirname (library);
  g_autofree char *stem = NULL;
  g_autofree char *hash = NULL;
  g_autofree char *name = NULL;

  if (env != NULL && *env != '\0')
    return absolute (env);
  /* A server library has no folder of its own: the user's data folder. */
  if (!lamina_library_is_server_address (path)
      && (g_file_test (beside, G_FILE_TEST_IS_DIR) || access (dir, W_OK) == 0))
    return g_steal_pointer (&beside);
  /* The library's folder cannot be written (a read-only share): the
   * user's own data folder, one folder per library path. */
  stem = stem_of (library);
  hash = g_compute_checksum_for_string (G_CHECKSUM_SHA256, library, -1);
  hash[8] = '\0';
  name = g_strdup_printf ("%s-%s", stem, hash);
  return g_build_filename (g_get_user_data_dir (), "lamina", "backups", name, NULL);
}

char *
lamina_library_dup_backup_dir (LaminaLibrary *self)
{
  const char *env = g_getenv ("LAMINA_BACKUP_DIR");
  g_autofree char *setting = NULL;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  if (BE (self) == NULL)
    return NULL;
  if (env == NULL || *env == '\0')
    setting = VT (self)->get_setting (BE (self), SETTING_FOLDER, NULL);
  if (setting != NULL && *setting != '\0')
    {
      /* A server library's relative folder: under the user's data folder. */
      g_autofree char *library = lamina_library_is_server_address (BE (self)->path)
        ? g_build_filename (g_get_user_data_dir (), "lamina", "backups", "server", NULL)
        : absolute (BE (self)->path);
      g_autofree char *dir = g_path_get_dirname (library);

      return g_path_is_absolute (setting) ? g_steal_pointer (&setting)
                                          : g_build_filename (dir, setting, NULL);
    }
  return lamina_backup_dup_dir_for_path (BE (self)->path);
}

guint
lamina_library_get_backup_keep (LaminaLibrary *self)
{
  g_autofree char *setting = NULL;
  guint64 keep = LAMINA_BACKUP_KEEP_DEFAULT;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), 0);
  if (BE (self) == NULL)
    return 0;
  setting = VT (self)->get_setting (BE (self), SETTING_KEEP, NULL);
  if (setting != NULL && !g_ascii_string_to_unsigned (setting, 10, 0, 1000, &keep, NULL))
    keep = LAMINA_BACKUP_KEEP_DEFAULT;
  return (guint) keep;
}

gboolean
lamina_library_set_backup_settings (LaminaLibrary  *self,
                                    const char     *folder,
                                    int             keep,
                                    GError        **error)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), FALSE);
  BACKEND_OR_FAIL (self, error, FALSE);

  if (keep > 1000)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID,
                   "backup-keep: %d is not a number of copies from 0 to 1000", keep);
      return FALSE;
    }
  if (folder != NULL && !VT (self)->set_setting (BE (self), SETTING_FOLDER,
                                                 *folder ? folder : NULL, error))
    return FALSE;
  if (keep >= 0)
    {
      g_autofree char *text = g_strdup_printf ("%d", keep);

      if (!VT (self)->set_setting (BE (self), SETTING_KEEP, text, error))
        return FALSE;
    }
  return TRUE;
}

/* NAME-YYYYMMDD-HHMMSS[…].sqlite */
static gboolean
is_backup_name (const char *name,
                const char *stem)
{
  size_t n = strlen (stem);

  if (strncmp (name, stem, n) != 0 || name[n] != '-' || !g_str_has_suffix (name, ".sqlite"))
    return FALSE;
  name += n + 1;
  for (int i = 0; i < 15; i++)
    if (i == 8 ? name[i] != '-' : !g_ascii_isdigit (name[i]))
      return FALSE;
  /* A damaged file kept by a restore is no backup to go back to. */
  if (strstr (name, "-damaged") != NULL)
    return FALSE;
  return name[15] == '.' || name[15] == '-';
}

typedef struct
{
  char   *path;
  char    stamp[16];  /* YYYYMMDD-HHMMSS from the name */
  gint64  mtime;      /* ns */
} Copy;

/* By the stamp in the name; copies of one second by modification time. */
static int
newest_first (gconstpointer a,
              gconstpointer b)
{
  const Copy *ca = a, *cb = b;
  int c = strcmp (cb->stamp, ca->stamp);

  if (c != 0)
    return c;
  if (ca->mtime != cb->mtime)
    return ca->mtime < cb->mtime ? 1 : -1;
  return strcmp (cb->path, ca->path);
}

GPtrArray *
lamina_backup_list (const char *library_path,
                    const char *dir)
{
  GPtrArray *list = g_ptr_array_new_with_free_func (g_free);
  g_autoptr(GArray) copies = g_array_new (FALSE, TRUE, sizeof (Copy));
  g_autofree char *own_dir = dir ? NULL : lamina_backup_dup_dir_for_path (library_path);
  g_autofree char *stem = stem_of (library_path);
  g_autoptr(GDir) d = g_dir_open (dir ? dir : own_dir, 0, NULL);
  const char *name;

  while (d != NULL && (name = g_dir_read_name (d)) != NULL)
    if (is_backup_name (name, stem))
      {
        Copy copy = { g_build_filename (dir ? dir : own_dir, name, NULL), "", 0 };
        GStatBuf st;

        memcpy (copy.stamp, name + strlen (stem) + 1, 15);
        if (g_stat (copy.path, &st) == 0)
          copy.mtime = (gint64) st.st_mtim.tv_sec * 1000000000 + st.st_mtim.tv_nsec;
        g_array_append_val (copies, copy);
      }
  g_array_sort (copies, newest_first);
  for (guint i = 0; i < copies->len; i++)
    g_ptr_array_add (list, g_array_index (copies, Copy, i).path);
  return list;
}

char *
lamina_backup_dup_latest_for_path (const char *path)
{
  g_autoptr(GPtrArray) list = lamina_backup_list (path, NULL);

  return list->len > 0 ? g_strdup (list->pdata[0]) : NULL;
}

static gboolean
sync_path (const char  *path,
           gboolean     directory,
           GError     **error)
{
  int fd = open (path, (directory ? O_RDONLY | O_DIRECTORY : O_RDWR) | O_CLOEXEC);

  if (fd < 0 || fsync (fd) != 0)
    {
      int saved = errno;

      if (fd >= 0)
        close (fd);
      /* Some file systems cannot sync a folder; the file itself is. */
      if (directory && (saved == EINVAL || saved == EBADF))
        return TRUE;
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                   "%s: cannot write the backup to disk: %s", path, g_strerror (saved));
      return FALSE;
    }
  return close (fd) == 0 || directory;
}

static void
remove_stale_partials (const char *dir,
                       const char *stem)
{
  g_autofree char *prefix = g_strdup_printf (".%s-partial-", stem);
  g_autoptr(GDir) d = g_dir_open (dir, 0, NULL);
  const char *name;

  while (d != NULL && (name = g_dir_read_name (d)) != NULL)
    if (g_str_has_prefix (name, prefix))
      {
        g_autofree char *path = g_build_filename (dir, name, NULL);
        g_autofree char *pid_text = g_strdup (name + strlen (prefix));
        char *end = strchr (pid_text, '.');
        long pid;

        if (end != NULL)
          *end = '\0';
        pid = atol (pid_text);
        /* Only copies whose maker is gone (a crash, SIGKILL). */
        if (pid > 0 && (kill ((pid_t) pid, 0) == 0 || errno != ESRCH))
          continue;
        g_unlink (path);
      }
}

/* A copy of @self as @name in @dir: written beside, synced, renamed. */
static char *
write_copy (LaminaLibrary  *self,
            const char     *dir,
            const char     *suffix,
            GError        **error)
{
  g_autofree char *stem = stem_of (BE (self)->path);
  g_autoptr(GDateTime) now = g_date_time_new_now_local ();
  g_autofree char *stamp = g_date_time_format (now, "%Y%m%d-%H%M%S");
  g_autofree char *partial = NULL;
  g_autofree char *target = NULL;

  if (VT (self)->backup_to == NULL)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_FAILED,
                   "%s: backups are not supported for this library "
                   "(the server's own backup keeps it)", BE (self)->path);
      return NULL;
    }
  if (g_mkdir_with_parents (dir, 0777) != 0)
    {
      int saved = errno;

      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                   "%s: cannot make the backup folder: %s", dir, g_strerror (saved));
      return NULL;
    }
  remove_stale_partials (dir, stem);
  target = g_strdup_printf ("%s/%s-%s%s.sqlite", dir, stem, stamp, suffix);
  for (int i = 2; g_file_test (target, G_FILE_TEST_EXISTS); i++)
    {
      g_free (target);
      target = g_strdup_printf ("%s/%s-%s%s-%d.sqlite", dir, stem, stamp, suffix, i);
    }
  partial = g_strdup_printf ("%s/.%s-partial-%ld.sqlite", dir, stem, (long) getpid ());
  g_unlink (partial);
  if (!VT (self)->backup_to (BE (self), partial, error)
      || !sync_path (partial, FALSE, error))
    {
      g_unlink (partial);
      return NULL;
    }
  if (g_rename (partial, target) != 0)
    {
      int saved = errno;

      g_unlink (partial);
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                   "%s: cannot keep the backup: %s", target, g_strerror (saved));
      return NULL;
    }
  if (!sync_path (dir, TRUE, error))
    return NULL;
  return g_steal_pointer (&target);
}

static void
rotate (const char *library_path,
        const char *dir,
        guint       keep)
{
  g_autoptr(GPtrArray) list = lamina_backup_list (library_path, dir);

  for (guint i = keep; i < list->len; i++)
    /* Another program rotating at the same moment may have been first. */
    if (g_unlink (list->pdata[i]) != 0 && errno != ENOENT)
      g_warning ("%s: cannot remove an old backup: %s", (char *) list->pdata[i],
                 g_strerror (errno));
}

char *
lamina_library_backup_now (LaminaLibrary  *self,
                           GError        **error)
{
  g_autofree char *dir = NULL;
  char *made;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  BACKEND_OR_FAIL (self, error, NULL);

  dir = lamina_library_dup_backup_dir (self);
  made = write_copy (self, dir, "", error);
  if (made != NULL)
    rotate (BE (self)->path, dir, MAX (lamina_library_get_backup_keep (self), 1));
  return made;
}

char *
lamina_library_backup_daily (LaminaLibrary  *self,
                             GError        **error)
{
  g_autoptr(GDateTime) now = g_date_time_new_now_local ();
  g_autofree char *today = g_date_time_format (now, "%Y%m%d");
  g_autofree char *dir = NULL;
  g_autofree char *stem = NULL;
  g_autoptr(GPtrArray) list = NULL;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  BACKEND_OR_FAIL (self, error, NULL);

  /* Nothing can change a read-only library through us.  A server
   * library is backed up by its administrator (lamina-cli backup, the
   * server's own backups), not by every colleague's window each day. */
  if (lamina_library_is_read_only (self) || VT (self)->backup_to == NULL
      || lamina_library_is_server_address (BE (self)->path)
      || lamina_library_get_backup_keep (self) == 0)
    return NULL;
  dir = lamina_library_dup_backup_dir (self);
  stem = stem_of (BE (self)->path);
  list = lamina_backup_list (BE (self)->path, dir);
  for (guint i = 0; i < list->len; i++)
    {
      g_autofree char *base = g_path_get_basename (list->pdata[i]);

      if (strncmp (base + strlen (stem) + 1, today, 8) == 0)
        return NULL;
    }
  return lamina_library_backup_now (self, error);
}

/* A raw copy of a file that SQLite cannot read any more (damaged), with
 * its journal, so that nothing of it is lost by a restore. */
static gboolean
copy_raw (const char  *from,
          const char  *to,
          GError     **error)
{
  g_autofree char *data = NULL;
  gsize len = 0;

  if (!g_file_get_contents (from, &data, &len, error)
      || !g_file_set_contents (to, data, len, error))
    return FALSE;
  return TRUE;
}

/* @backup (a checked copy) into the library at @library_path. */
static gboolean
restore_checked (const char  *library_path,
                 const char  *backup,
                 const char  *dir,
                 char       **kept,
                 GError     **error)
{
  g_autoptr(LaminaLibrary) current = NULL;
  g_autoptr(GError) local = NULL;
  g_autofree char *copy = NULL;

  if (g_file_test (library_path, G_FILE_TEST_EXISTS))
    current = lamina_library_open (library_path, LAMINA_LIBRARY_OPEN_EXISTING, &local);
  if (current != NULL && lamina_library_is_read_only (current))
    {
      lamina_backend_set_read_only_error (BE (current), error);
      return FALSE;
    }
  if (current != NULL)
    {
      /* Keep what is there now, then copy the backup in through SQLite,
       * which waits for other writers and shows others the whole change
       * at once. */
      copy = write_copy (current, dir, "-before-restore", &local);
      if (copy == NULL && g_error_matches (local, LAMINA_LIBRARY_ERROR,
                                           LAMINA_LIBRARY_ERROR_CORRUPT))
        {
          /* Damaged but readable: keep it as it is, and replace it whole. */
          g_clear_error (&local);
          g_clear_object (&current);
        }
      else if (copy == NULL)
        {
          g_propagate_error (error, g_steal_pointer (&local));
          return FALSE;
        }
    }
  if (current != NULL)
    {
      if (VT (current)->restore_from == NULL)
        {
          g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_FAILED,
                       "%s: restoring is not supported for this library", library_path);
          return FALSE;
        }
      if (!VT (current)->restore_from (BE (current), backup, error))
        return FALSE;
    }
  else
    {
      g_autofree char *stem = stem_of (library_path);
      g_autoptr(GDateTime) now = g_date_time_new_now_local ();
      g_autofree char *stamp = g_date_time_format (now, "%Y%m%d-%H%M%S");
      g_autofree char *library_dir = g_path_get_dirname (library_path);
      g_autofree char *partial = g_strdup_printf ("%s/.%s-restore-%ld.sqlite", library_dir,
                                                  stem, (long) getpid ());
      g_autofree char *wal = g_strconcat (library_path, "-wal", NULL);
      g_autofree char *shm = g_strconcat (library_path, "-shm", NULL);

      /* Missing or unreadable (damaged): the file is replaced whole; the
       * damaged one is kept as it was, journal and all. */
      if (g_file_test (library_path, G_FILE_TEST_EXISTS))
        {
          g_autofree char *kept_wal = NULL;

          if (g_mkdir_with_parents (dir, 0777) != 0)
            {
              int saved = errno;
              g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                           "%s: cannot make the backup folder: %s", dir, g_strerror (saved));
              return FALSE;
            }
          copy = g_strdup_printf ("%s/%s-%s-damaged.sqlite", dir, stem, stamp);
          kept_wal = g_strconcat (copy, "-wal", NULL);
          if (!copy_raw (library_path, copy, error)
              || (g_file_test (wal, G_FILE_TEST_EXISTS) && !copy_raw (wal, kept_wal, error)))
            return FALSE;
        }
      if (g_mkdir_with_parents (library_dir, 0777) != 0 || !copy_raw (backup, partial, error)
          || !sync_path (partial, FALSE, error))
        {
          g_unlink (partial);
          if (error != NULL && *error == NULL)
            g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                         "%s: cannot write: %s", library_path, g_strerror (errno));
          return FALSE;
        }
      /* A journal of the damaged file must not be applied to the copy. */
      g_unlink (wal);
      g_unlink (shm);
      if (g_rename (partial, library_path) != 0)
        {
          int saved = errno;

          g_unlink (partial);
          g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                       "%s: cannot replace: %s", library_path, g_strerror (saved));
          return FALSE;
        }
      sync_path (library_dir, TRUE, NULL);
    }
  if (kept != NULL)
    *kept = g_steal_pointer (&copy);
  return TRUE;
}

static void
remove_file_and_journal (const char *path)
{
  g_autofree char *wal = g_strconcat (path, "-wal", NULL);
  g_autofree char *shm = g_strconcat (path, "-shm", NULL);

  g_unlink (wal);
  g_unlink (shm);
  g_unlink (path);
}

gboolean
lamina_library_restore_backup (const char  *library_path,
                               const char  *backup,
                               const char  *dir,
                               char       **kept,
                               GError     **error)
{
  g_autoptr(LaminaLibrary) source = NULL;
  g_autoptr(GError) local = NULL;
  g_autoptr(GPtrArray) problems = g_ptr_array_new_with_free_func (g_free);
  g_autofree char *own_dir = NULL;
  g_autofree char *stem = NULL;
  g_autofree char *library_dir = NULL;
  g_autofree char *checked = NULL;
  gboolean ok;

  g_return_val_if_fail (library_path != NULL && backup != NULL, FALSE);

  /* A server library is never overwritten by a restore: the server keeps
   * approved revisions and review records unchangeable, and colleagues
   * may have worked since the copy was made.  The backup goes into a new,
   * empty database through the copy (all or nothing, every revision and
   * review record kept); the office moves to it once it is checked. */
  if (lamina_library_is_server_address (library_path))
    {
      g_autofree char *label = lamina_pg_dup_label (library_path);

      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_FAILED,
                   "%s: a library on a server is not replaced by a restore; copy the backup "
                   "into a new, empty database (“lamina-cli copy --from %s --to "
                   "postgresql://…/NEW_DATABASE”), check it, and point the office at it; "
                   "the server's own backups bring back the database as a whole; "
                   "nothing was changed", label, backup);
      return FALSE;
    }
  if (dir == NULL)
    dir = own_dir = lamina_backup_dup_dir_for_path (library_path);

  /* The copy is checked, and brought up to this version's format if it
   * is older, as a working copy beside the library: the backup itself is
   * never changed, and a bad one is refused before anything is touched. */
  stem = stem_of (library_path);
  library_dir = g_path_get_dirname (library_path);
  checked = g_strdup_printf ("%s/.%s-restoring-%ld.sqlite", library_dir, stem, (long) getpid ());
  remove_file_and_journal (checked);
  if (g_mkdir_with_parents (library_dir, 0777) != 0 || !copy_raw (backup, checked, &local))
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                   "%s: cannot read the backup into %s: %s", backup, library_dir,
                   local ? local->message : g_strerror (errno));
      remove_file_and_journal (checked);
      return FALSE;
    }
  source = lamina_library_open (checked, LAMINA_LIBRARY_OPEN_EXISTING, &local);
  if (source != NULL && lamina_library_get_backup_path (source) != NULL)
    g_unlink (lamina_library_get_backup_path (source));
  if (source != NULL && VT (source)->verify_storage != NULL
      && !VT (source)->verify_storage (BE (source), problems, &local))
    g_clear_object (&source);
  if (source == NULL || problems->len > 0)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_CORRUPT,
                   "%s: this backup is not a sound library (%s); nothing was changed", backup,
                   problems->len > 0 ? (char *) problems->pdata[0] : local->message);
      g_clear_object (&source);
      remove_file_and_journal (checked);
      return FALSE;
    }
  /* Closed: one file again, the journal folded in. */
  g_clear_object (&source);
  ok = restore_checked (library_path, checked, dir, kept, error);
  remove_file_and_journal (checked);
  return ok;
}
