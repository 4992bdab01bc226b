/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-library-climates.c: the library's climates (EN ISO 13788) through
 * LaminaLibrary, and what a stored construction's moisture check records. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-library.h"

#include <math.h>

#include "lamina-library-backend.h"
#include "lamina-moisture.h"

GPtrArray *
lamina_library_list_climates (LaminaLibrary  *self,
                              GError        **error)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  BACKEND_OR_FAIL (self, error, NULL);
  return VT (self)->list_climates (BE (self), error);
}

LaminaClimate *
lamina_library_dup_climate (LaminaLibrary  *self,
                            const char     *id,
                            GError        **error)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  g_return_val_if_fail (id != NULL, NULL);
  BACKEND_OR_FAIL (self, error, NULL);
  return VT (self)->get_climate (BE (self), id, error);
}

gboolean
lamina_library_put_climate (LaminaLibrary        *self,
                            const LaminaClimate  *climate,
                            GError              **error)
{
  g_autoptr(GError) local = NULL;
  g_autofree char *now = NULL;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), FALSE);
  g_return_val_if_fail (climate != NULL, FALSE);
  BACKEND_OR_FAIL (self, error, FALSE);

  if (!lamina_climate_validate (climate, &local))
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID, "%s", local->message);
      return FALSE;
    }
  now = lamina_library_dup_now ();
  if (!VT (self)->put_climate (BE (self), climate, now, error))
    return FALSE;
  lamina_library_emit_changed (self);
  return TRUE;
}

LaminaSummaryFlags
lamina_library_moisture_flags (const LaminaConstruction *c)
{
  g_autoptr(LaminaMoistureResult) result = NULL;

  if (c->moisture == NULL)
    return LAMINA_SUMMARY_NONE;
  /* The office limit is the default until the library keeps one. */
  result = lamina_moisture_calculate_own (c, NAN, NULL);
  if (result == NULL || lamina_moisture_result_fails (result))
    return LAMINA_SUMMARY_HAS_MOISTURE | LAMINA_SUMMARY_MOISTURE_FAILS;
  return LAMINA_SUMMARY_HAS_MOISTURE;
}
