/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Replays every file in the directories given (seed corpus and regression
 * inputs found by fuzzing) through a fuzz target, without libFuzzer, so the
 * normal test suite keeps them fixed.  Prints TAP. */
#include <glib.h>
#include <stdint.h>
#include <stdio.h>

int LLVMFuzzerTestOneInput (const uint8_t *data, size_t size);

int
main (int    argc,
      char **argv)
{
  g_autoptr(GPtrArray) files = g_ptr_array_new_with_free_func (g_free);

  for (int i = 1; i < argc; i++)
    {
      g_autoptr(GDir) dir = g_dir_open (argv[i], 0, NULL);
      const char *name;

      if (dir == NULL)
        g_ptr_array_add (files, g_strdup (argv[i]));
      else
        while ((name = g_dir_read_name (dir)) != NULL)
          g_ptr_array_add (files, g_build_filename (argv[i], name, NULL));
    }
  g_ptr_array_sort (files, (GCompareFunc) g_strcmp0);
  printf ("1..%u\n", files->len);
  for (guint i = 0; i < files->len; i++)
    {
      g_autofree char *data = NULL;
      gsize size = 0;

      if (!g_file_get_contents (files->pdata[i], &data, &size, NULL))
        {
          printf ("not ok %u - cannot read %s\n", i + 1, (char *) files->pdata[i]);
          continue;
        }
      LLVMFuzzerTestOneInput ((const uint8_t *) data, size);
      printf ("ok %u - %s\n", i + 1, (char *) files->pdata[i]);
      fflush (stdout);
    }
  return 0;
}
