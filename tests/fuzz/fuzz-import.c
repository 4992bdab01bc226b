/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Fuzz target: a catalogue document imported into a fresh library
 * (lamina_library_import).  Afterwards the library must pass the full
 * integrity check and either hold every construction of the document
 * (added, with the document's content) or, when the import was refused,
 * be exactly as before. */
#include "lamina-hardening-util.h"

#include <stdint.h>
#include <unistd.h>

int LLVMFuzzerTestOneInput (const uint8_t *data, size_t size);

static char *template_path;
static char *work_path;
static char *empty_state;

static void
set_up (void)
{
  g_autofree char *dir = g_dir_make_tmp ("lamina-fuzz-import-XXXXXX", NULL);
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GError) error = NULL;

  g_assert (dir != NULL);
  template_path = g_build_filename (dir, "template.sqlite", NULL);
  work_path = g_build_filename (dir, "work.sqlite", NULL);
  library = lamina_library_open (template_path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  g_assert_no_error (error);
  empty_state = lamina_hardening_dup_state (library, &error);
  g_assert_no_error (error);
}

int
LLVMFuzzerTestOneInput (const uint8_t *data,
                        size_t         size)
{
  g_autoptr(LaminaCatalogue) catalogue = NULL;
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(LaminaImportReport) report = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *state = NULL;

  catalogue = lamina_catalogue_read_memory ((const char *) data, size, "fuzz.xml", &error);
  if (catalogue == NULL)
    return 0;
  if (template_path == NULL)
    set_up ();
  lamina_hardening_copy_library (template_path, work_path);
  library = lamina_library_open (work_path, LAMINA_LIBRARY_OPEN_EXISTING, &error);
  g_assert_no_error (error);
  report = lamina_library_import (library, catalogue, 0, "Fuzz", &error);
  if (report == NULL)
    {
      /* Refused: a clear error and nothing written. */
      g_assert (error != NULL && error->message[0] != '\0');
      g_clear_error (&error);
      state = lamina_hardening_dup_state (library, &error);
      g_assert_no_error (error);
      if (g_strcmp0 (state, empty_state) != 0)
        g_error ("a refused import changed the library: %s", "state differs");
    }
  else
    {
      g_assert (report->n_added + report->n_revised + report->n_skipped + report->n_conflicts
                >= catalogue->constructions->len);
      for (guint i = 0; i < catalogue->constructions->len; i++)
        {
          const LaminaConstruction *want = catalogue->constructions->pdata[i];
          g_autoptr(LaminaConstruction) got = NULL;

          if (want->id == NULL)
            continue;
          got = lamina_library_dup_construction (library, want->id, 0, &error);
          if (got == NULL)
            g_error ("imported construction %s is missing: %s", want->id, error->message);
          if (!lamina_construction_equal_content (want, got))
            g_error ("imported construction %s differs from the document", want->id);
        }
    }
  g_clear_object (&library);
  if (!lamina_hardening_check_library (work_path, &error))
    g_error ("library damaged by an import: %s", error->message);
  return 0;
}
