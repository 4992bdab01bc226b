/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Files that are written are whole, and nothing else is touched.
 * - A write that fails (a full device, a file size limit: the same
 *   ENOSPC/EFBIG a full disk gives) exits 1 naming the user's path, keeps
 *   the old file byte for byte, and leaves no temporary file.
 * - A device, a FIFO or a symbolic link given to -o is written through,
 *   never replaced by a regular file; "-o -" is standard output.
 * - Temporary files of our naming left by a killed writer are removed on
 *   the next write into that folder; one of a live process is not.
 * - A document read from a pipe or device is limited like a file.
 * The devices are reached through symbolic links in the test folder, so
 * that the old behaviour (replacing the path by a regular file) replaces
 * a link of ours, never the machine's /dev/full. */
#define G_LOG_DOMAIN "lamina-test"

#include <gio/gio.h>
#include <glib.h>
#include <glib/gstdio.h>
#include <signal.h>
#include <string.h>
#include <sys/resource.h>
#include <sys/stat.h>
#include <sys/wait.h>
#include <unistd.h>

#include "lamina-file.h"
#include "lamina-hardening-util.h"

static char *
dup_cli (void)
{
  return g_build_filename (g_getenv ("LAMINA_BUILD_DIR"), "src", "cli", "lamina-cli", NULL);
}

static char *
dup_demo_xml (void)
{
  return g_build_filename (g_getenv ("LAMINA_SOURCE_DIR"), "data", "demo", "lamina-demo.xml", NULL);
}

static void
limit_file_size_cb (gpointer data)
{
  struct rlimit limit = { 16 * 1024, 16 * 1024 };

  /* The write then fails with EFBIG instead of killing the process. */
  signal (SIGXFSZ, SIG_IGN);
  setrlimit (RLIMIT_FSIZE, &limit);
}

/* Runs lamina-cli with @args (NULL-terminated), optionally under a 16 KiB
 * file size limit. */
static int
run (gboolean     limited,
     char       **out,
     char       **err,
     const char  *first,
     ...)
{
  g_autoptr(GPtrArray) argv = g_ptr_array_new_with_free_func (g_free);
  int status = -1;
  va_list ap;

  g_ptr_array_add (argv, dup_cli ());
  va_start (ap, first);
  for (const char *a = first; a != NULL; a = va_arg (ap, const char *))
    g_ptr_array_add (argv, g_strdup (a));
  va_end (ap);
  g_ptr_array_add (argv, NULL);
  g_assert_true (g_spawn_sync (NULL, (char **) argv->pdata, NULL, G_SPAWN_DEFAULT,
                               limited ? limit_file_size_cb : NULL, NULL, out, err, &status, NULL));
  return WIFEXITED (status) ? WEXITSTATUS (status) : -1;
}

static char *
make_folder (const char *name)
{
  char *dir = g_build_filename (g_get_user_data_dir (), name, NULL);

  g_assert_cmpint (g_mkdir_with_parents (dir, 0700), ==, 0);
  return dir;
}

static void
assert_no_temporaries (const char *dir)
{
  g_autoptr(GDir) d = g_dir_open (dir, 0, NULL);
  const char *name;

  g_assert_nonnull (d);
  while ((name = g_dir_read_name (d)) != NULL)
    {
      g_assert_null (strstr (name, ".lamina-"));
      g_assert_null (strstr (name, ".part"));
    }
}

static void
assert_kind (const char *path,
             mode_t      kind)
{
  GStatBuf st;

  g_assert_cmpint (g_lstat (path, &st), ==, 0);
  g_assert_cmpuint (st.st_mode & S_IFMT, ==, kind);
}

/* A full disk under a sheet, a catalogue, a section image and an export
 * that replace a good file (--force). */
static void
test_write_failure_keeps_old_file (void)
{
  g_autofree char *dir = make_folder ("full");
  g_autofree char *xml = dup_demo_xml ();
  const char *outputs[][2] = {
    { "catalogue", "catalogue.pdf" },
    { "sheet", "sheet.pdf" },
    { "section", "section.png" },
  };

  for (guint i = 0; i < G_N_ELEMENTS (outputs); i++)
    {
      g_autofree char *path = g_build_filename (dir, outputs[i][1], NULL);
      g_autofree char *out = NULL, *err = NULL, *kept = NULL;
      /* Larger than the limit: the old content is not a truncated new one. */
      g_autofree char *old = g_strnfill (20000, 'o');

      g_assert_true (g_file_set_contents (path, old, -1, NULL));
      if (i == 0)
        g_assert_cmpint (run (TRUE, &out, &err, "--force", "catalogue", "--from", xml, "-o", path, NULL), ==, 1);
      else if (i == 1)
        g_assert_cmpint (run (TRUE, &out, &err, "--force", "sheet", "EW-101", "--from", xml, "-o", path, NULL), ==, 1);
      else
        g_assert_cmpint (run (TRUE, &out, &err, "--force", "section", "EW-101", "--from", xml,
                              "--width", "4000", "--height", "4000", "-o", path, NULL), ==, 1);
      /* "PATH: File too large": the user's path, not a temporary name. */
      g_assert_nonnull (strstr (err, path));
      g_assert_null (strstr (err, ".lamina-"));
      g_assert_true (g_file_get_contents (path, &kept, NULL, NULL));
      g_assert_cmpstr (kept, ==, old);
      assert_no_temporaries (dir);
    }
}

static void
test_devices_stay_devices (void)
{
  g_autofree char *dir = make_folder ("devices");
  g_autofree char *xml = dup_demo_xml ();
  g_autofree char *full = g_build_filename (dir, "full", NULL);
  g_autofree char *null = g_build_filename (dir, "null", NULL);
  const char *commands[] = { "sheet", "section", "catalogue", "export" };

  g_assert_cmpint (symlink ("/dev/full", full), ==, 0);
  g_assert_cmpint (symlink ("/dev/null", null), ==, 0);
  for (guint i = 0; i < G_N_ELEMENTS (commands); i++)
    {
      g_autofree char *library = g_build_filename (dir, "library.sqlite", NULL);
      g_autofree char *out = NULL, *err = NULL;
      gboolean export = strcmp (commands[i], "export") == 0;
      gboolean catalogue = strcmp (commands[i], "catalogue") == 0;

      if (export)
        {
          g_assert_cmpint (run (FALSE, &out, &err, "--library", library, "import", xml, NULL), ==, 0);
          g_clear_pointer (&out, g_free);
          g_clear_pointer (&err, g_free);
          g_assert_cmpint (run (FALSE, &out, &err, "--library", library, "--force", "export", "-o", full, NULL), ==, 1);
        }
      else if (catalogue)
        g_assert_cmpint (run (FALSE, &out, &err, "--force", "catalogue", "--from", xml, "-o", full, NULL), ==, 1);
      else
        g_assert_cmpint (run (FALSE, &out, &err, "--force", commands[i], "EW-101", "--from", xml, "-o", full, NULL), ==, 1);
      /* ENOSPC from the device itself, named by the user's path. */
      g_assert_nonnull (strstr (err, full));
      assert_kind (full, S_IFLNK);
      assert_kind ("/dev/full", S_IFCHR);
      g_clear_pointer (&out, g_free);
      g_clear_pointer (&err, g_free);

      /* /dev/null takes it all, without --force: nothing is replaced. */
      if (export)
        g_assert_cmpint (run (FALSE, &out, &err, "--library", library, "export", "-o", null, NULL), ==, 0);
      else if (catalogue)
        g_assert_cmpint (run (FALSE, &out, &err, "catalogue", "--from", xml, "-o", null, NULL), ==, 0);
      else
        g_assert_cmpint (run (FALSE, &out, &err, commands[i], "EW-101", "--from", xml, "-o", null, NULL), ==, 0);
      assert_kind (null, S_IFLNK);
      assert_kind ("/dev/null", S_IFCHR);
    }
  assert_no_temporaries (dir);
}

static gpointer
drain_fifo_cb (gpointer data)
{
  g_autofree char *contents = NULL;
  gsize length = 0;

  g_assert_true (g_file_get_contents (data, &contents, &length, NULL));
  return g_bytes_new_take (g_steal_pointer (&contents), length);
}

static void
test_fifo_and_link (void)
{
  g_autofree char *dir = make_folder ("fifo");
  g_autofree char *xml = dup_demo_xml ();
  g_autofree char *fifo = g_build_filename (dir, "pipe.png", NULL);
  g_autofree char *link = g_build_filename (dir, "link.pdf", NULL);
  g_autofree char *real = g_build_filename (dir, "real.pdf", NULL);
  g_autofree char *out = NULL, *err = NULL, *contents = NULL;
  g_autoptr(GBytes) read = NULL;
  GThread *reader;
  gsize length;

  g_assert_cmpint (mkfifo (fifo, 0600), ==, 0);
  reader = g_thread_new ("reader", drain_fifo_cb, fifo);
  g_assert_cmpint (run (FALSE, &out, &err, "--force", "section", "EW-101", "--from", xml, "-o", fifo, NULL), ==, 0);
  read = g_thread_join (reader);
  /* The PNG signature (ISO/IEC 15948, 5.2) came through the pipe. */
  g_assert_cmpuint (g_bytes_get_size (read), >, 8);
  g_assert_cmpmem (g_bytes_get_data (read, NULL), 8, "\x89PNG\r\n\x1a\n", 8);
  assert_kind (fifo, S_IFIFO);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);

  /* A link to a file: the file is replaced, the link stays. */
  g_assert_cmpint (symlink ("real.pdf", link), ==, 0);
  g_assert_true (g_file_set_contents (real, "old", -1, NULL));
  g_assert_cmpint (run (FALSE, &out, &err, "sheet", "EW-101", "--from", xml, "-o", link, NULL), ==, 1);
  g_assert_nonnull (strstr (err, "--force"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (FALSE, &out, &err, "--force", "sheet", "EW-101", "--from", xml, "-o", link, NULL), ==, 0);
  assert_kind (link, S_IFLNK);
  g_assert_true (g_file_get_contents (real, &contents, &length, NULL));
  g_assert_true (g_str_has_prefix (contents, "%PDF-"));
  assert_no_temporaries (dir);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);

  /* "-o -": the whole PDF on standard output (ISO 32000-1, 7.5.5: the
   * file ends with %%EOF). */
  {
    g_autofree char *cli = dup_cli ();
    g_autoptr(GSubprocess) p = g_subprocess_new (G_SUBPROCESS_FLAGS_STDOUT_PIPE, NULL, cli, "sheet",
                                                 "EW-101", "--from", xml, "-o", "-", NULL);
    g_autoptr(GBytes) pdf = NULL;
    gsize size;
    const char *bytes;

    g_assert_true (g_subprocess_communicate (p, NULL, NULL, &pdf, NULL, NULL));
    g_assert_true (g_subprocess_get_successful (p));
    bytes = g_bytes_get_data (pdf, &size);
    g_assert_cmpuint (size, >, 1000);
    g_assert_cmpmem (bytes, 5, "%PDF-", 5);
    g_assert_nonnull (g_strstr_len (bytes + size - 16, 16, "%%EOF"));
  }
}

static void
test_stale_temporaries (void)
{
  g_autofree char *dir = make_folder ("stale");
  g_autofree char *xml = dup_demo_xml ();
  g_autofree char *path = g_build_filename (dir, "out.pdf", NULL);
  g_autofree char *out = NULL, *err = NULL;
  g_autofree char *stale = NULL, *live = NULL;
  const char *argv[] = { "/bin/true", NULL };
  GPid dead;
  int status;

  /* A process that has ended: its PID is free. */
  g_assert_true (g_spawn_async (NULL, (char **) argv, NULL, G_SPAWN_DO_NOT_REAP_CHILD, NULL, NULL,
                                &dead, NULL));
  g_assert_cmpint (waitpid (dead, &status, 0), ==, dead);
  stale = g_strdup_printf ("%s/.out.pdf.lamina-%d-Ab12Cd", dir, (int) dead);
  live = g_strdup_printf ("%s/.other.pdf.lamina-%d-Ab12Cd", dir, (int) getpid ());
  g_assert_true (g_file_set_contents (stale, "%PDF-1.5 half", -1, NULL));
  g_assert_true (g_file_set_contents (live, "being written", -1, NULL));
  g_assert_cmpint (run (FALSE, &out, &err, "sheet", "EW-101", "--from", xml, "-o", path, NULL), ==, 0);
  g_assert_false (g_file_test (stale, G_FILE_TEST_EXISTS));
  g_assert_true (g_file_test (live, G_FILE_TEST_EXISTS));
  g_assert_true (g_file_test (path, G_FILE_TEST_IS_REGULAR));
}

static void
test_read_limit (void)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *data = NULL;
  g_autofree char *out = NULL, *err = NULL;
  gsize length = 0;

  /* A device that never ends stops at the limit. */
  data = lamina_file_read_limited ("/dev/zero", 1024 * 1024, &length, &error);
  g_assert_null (data);
  g_assert_error (error, LAMINA_FILE_ERROR, LAMINA_FILE_ERROR_TOO_BIG);
  g_assert_nonnull (strstr (error->message, "/dev/zero"));
  g_clear_error (&error);
  data = lamina_file_read_limited ("/dev/null", 1024, &length, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (length, ==, 0);

  /* The CLI: "/dev/zero:1: the document is larger than 256 MiB", exit 1. */
  g_assert_cmpint (run (FALSE, &out, &err, "calc", "/dev/zero", NULL), ==, 1);
  g_assert_nonnull (strstr (err, "/dev/zero:1: the document is larger than 256 MiB"));
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);
  g_test_add_func ("/hardening/files/write-failure-keeps-old-file", test_write_failure_keeps_old_file);
  g_test_add_func ("/hardening/files/devices-stay-devices", test_devices_stay_devices);
  g_test_add_func ("/hardening/files/fifo-link-stdout", test_fifo_and_link);
  g_test_add_func ("/hardening/files/stale-temporaries", test_stale_temporaries);
  g_test_add_func ("/hardening/files/read-limit", test_read_limit);
  return g_test_run ();
}
