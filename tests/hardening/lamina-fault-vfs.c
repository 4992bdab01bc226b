/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-fault-vfs.c: a pass-through SQLite VFS that can crash the process
 * at the k-th write or report a full disk (see lamina-fault-vfs.h). */
#define G_LOG_DOMAIN "lamina-test"

#include "lamina-fault-vfs.h"

#include <sqlite3.h>
#include <string.h>
#include <unistd.h>

typedef struct
{
  sqlite3_file  base;
  sqlite3_file *real;   /* follows this struct in the same allocation */
} FaultFile;

static sqlite3_vfs fault_vfs;
static sqlite3_vfs *real_vfs;
static guint64 write_count;
static guint64 exit_after;
static gint64 free_bytes = -1;

#define REAL(f) (((FaultFile *) (f))->real)

static void
count_write (void)
{
  write_count++;
  if (exit_after != 0 && write_count >= exit_after)
    _exit (LAMINA_FAULT_EXIT_STATUS);
}

static int
fault_close (sqlite3_file *f)
{
  int rc = REAL (f)->pMethods->xClose (REAL (f));

  return rc;
}

static int
fault_read (sqlite3_file *f, void *buf, int amt, sqlite3_int64 off)
{
  return REAL (f)->pMethods->xRead (REAL (f), buf, amt, off);
}

static int
fault_write (sqlite3_file *f, const void *buf, int amt, sqlite3_int64 off)
{
  count_write ();
  if (free_bytes >= 0)
    {
      sqlite3_int64 size = 0;

      REAL (f)->pMethods->xFileSize (REAL (f), &size);
      if (off + amt > size)
        {
          sqlite3_int64 grow = off + amt - size;

          if (grow > free_bytes)
            return SQLITE_FULL;
          free_bytes -= grow;
        }
    }
  return REAL (f)->pMethods->xWrite (REAL (f), buf, amt, off);
}

static int
fault_truncate (sqlite3_file *f, sqlite3_int64 size)
{
  count_write ();
  return REAL (f)->pMethods->xTruncate (REAL (f), size);
}

static int
fault_sync (sqlite3_file *f, int flags)
{
  count_write ();
  return REAL (f)->pMethods->xSync (REAL (f), flags);
}

static int
fault_file_size (sqlite3_file *f, sqlite3_int64 *size)
{
  return REAL (f)->pMethods->xFileSize (REAL (f), size);
}

static int
fault_lock (sqlite3_file *f, int level)
{
  return REAL (f)->pMethods->xLock (REAL (f), level);
}

static int
fault_unlock (sqlite3_file *f, int level)
{
  return REAL (f)->pMethods->xUnlock (REAL (f), level);
}

static int
fault_check_reserved (sqlite3_file *f, int *out)
{
  return REAL (f)->pMethods->xCheckReservedLock (REAL (f), out);
}

static int
fault_file_control (sqlite3_file *f, int op, void *arg)
{
  return REAL (f)->pMethods->xFileControl (REAL (f), op, arg);
}

static int
fault_sector_size (sqlite3_file *f)
{
  return REAL (f)->pMethods->xSectorSize (REAL (f));
}

static int
fault_device_characteristics (sqlite3_file *f)
{
  return REAL (f)->pMethods->xDeviceCharacteristics (REAL (f));
}

static int
fault_shm_map (sqlite3_file *f, int page, int size, int extend, void volatile **out)
{
  return REAL (f)->pMethods->xShmMap (REAL (f), page, size, extend, out);
}

static int
fault_shm_lock (sqlite3_file *f, int offset, int n, int flags)
{
  return REAL (f)->pMethods->xShmLock (REAL (f), offset, n, flags);
}

static void
fault_shm_barrier (sqlite3_file *f)
{
  REAL (f)->pMethods->xShmBarrier (REAL (f));
}

static int
fault_shm_unmap (sqlite3_file *f, int delete_flag)
{
  return REAL (f)->pMethods->xShmUnmap (REAL (f), delete_flag);
}

static int
fault_fetch (sqlite3_file *f, sqlite3_int64 off, int amt, void **out)
{
  return REAL (f)->pMethods->xFetch (REAL (f), off, amt, out);
}

static int
fault_unfetch (sqlite3_file *f, sqlite3_int64 off, void *p)
{
  return REAL (f)->pMethods->xUnfetch (REAL (f), off, p);
}

static const sqlite3_io_methods fault_io = {
  3,
  fault_close, fault_read, fault_write, fault_truncate, fault_sync, fault_file_size,
  fault_lock, fault_unlock, fault_check_reserved, fault_file_control, fault_sector_size,
  fault_device_characteristics, fault_shm_map, fault_shm_lock, fault_shm_barrier,
  fault_shm_unmap, fault_fetch, fault_unfetch,
};

static int
fault_open (sqlite3_vfs *vfs, const char *name, sqlite3_file *f, int flags, int *out_flags)
{
  FaultFile *ff = (FaultFile *) f;
  int rc;

  ff->real = (sqlite3_file *) &ff[1];
  memset (ff->real, 0, (size_t) real_vfs->szOsFile);
  rc = real_vfs->xOpen (real_vfs, name, ff->real, flags, out_flags);
  /* SQLite calls xClose only when pMethods is set: leave it NULL when
   * the real open did not set its own. */
  f->pMethods = ff->real->pMethods != NULL ? &fault_io : NULL;
  return rc;
}

static int
fault_delete (sqlite3_vfs *vfs, const char *name, int sync_dir)
{
  count_write ();
  return real_vfs->xDelete (real_vfs, name, sync_dir);
}

static int
fault_access (sqlite3_vfs *vfs, const char *name, int flags, int *out)
{
  return real_vfs->xAccess (real_vfs, name, flags, out);
}

static int
fault_full_pathname (sqlite3_vfs *vfs, const char *name, int n, char *out)
{
  return real_vfs->xFullPathname (real_vfs, name, n, out);
}

static int
fault_randomness (sqlite3_vfs *vfs, int n, char *out)
{
  return real_vfs->xRandomness (real_vfs, n, out);
}

static int
fault_sleep (sqlite3_vfs *vfs, int us)
{
  return real_vfs->xSleep (real_vfs, us);
}

static int
fault_current_time (sqlite3_vfs *vfs, double *out)
{
  return real_vfs->xCurrentTime (real_vfs, out);
}

static int
fault_get_last_error (sqlite3_vfs *vfs, int n, char *out)
{
  return real_vfs->xGetLastError ? real_vfs->xGetLastError (real_vfs, n, out) : 0;
}

static int
fault_current_time_int64 (sqlite3_vfs *vfs, sqlite3_int64 *out)
{
  return real_vfs->xCurrentTimeInt64 (real_vfs, out);
}

void
lamina_fault_vfs_install (void)
{
  if (real_vfs != NULL)
    return;
  real_vfs = sqlite3_vfs_find (NULL);
  g_assert (real_vfs != NULL && real_vfs->iVersion >= 2);
  fault_vfs = (sqlite3_vfs) {
    .iVersion = 2,
    .szOsFile = (int) sizeof (FaultFile) + real_vfs->szOsFile,
    .mxPathname = real_vfs->mxPathname,
    .zName = "lamina-fault",
    .xOpen = fault_open,
    .xDelete = fault_delete,
    .xAccess = fault_access,
    .xFullPathname = fault_full_pathname,
    .xRandomness = fault_randomness,
    .xSleep = fault_sleep,
    .xCurrentTime = fault_current_time,
    .xGetLastError = fault_get_last_error,
    .xCurrentTimeInt64 = fault_current_time_int64,
  };
  g_assert_cmpint (sqlite3_vfs_register (&fault_vfs, 1), ==, SQLITE_OK);
}

void
lamina_fault_vfs_set_exit_after (guint64 k)
{
  write_count = 0;
  exit_after = k;
}

void
lamina_fault_vfs_set_free_bytes (gint64 bytes)
{
  free_bytes = bytes;
}

guint64
lamina_fault_vfs_get_count (void)
{
  return write_count;
}
