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

gboolean
lamina_library_delete_climate (LaminaLibrary  *self,
                               const char     *id,
                               GError        **error)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), FALSE);
  g_return_val_if_fail (id != NULL, FALSE);
  BACKEND_OR_FAIL (self, error, FALSE);

  if (VT (self)->delete_climate == NULL)
    {
      g_set_error_literal (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_FAILED,
                           "deleting a climate is not supported by this library");
      return FALSE;
    }
  if (!VT (self)->delete_climate (BE (self), id, error))
    return FALSE;
  lamina_library_emit_changed (self);
  return TRUE;
}

double
lamina_library_moisture_limit_from_text (const char *value)
{
  char *end = NULL;
  double limit;

  if (value == NULL)
    return NAN;
  limit = g_ascii_strtod (value, &end);
  if (end == value || *end != '\0' || !LAMINA_MOISTURE_LIMIT_IS_VALID (limit))
    return NAN;
  return limit;
}

double
lamina_library_get_moisture_limit (LaminaLibrary *self)
{
  g_autofree char *value = NULL;
  double limit;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), LAMINA_MOISTURE_DEFAULT_LIMIT);
  if (BE (self) == NULL)
    return LAMINA_MOISTURE_DEFAULT_LIMIT;
  value = VT (self)->get_setting (BE (self), LAMINA_MOISTURE_LIMIT_KEY, NULL);
  /* Anything unreadable is read as the default, as for the review policy. */
  limit = lamina_library_moisture_limit_from_text (value);
  return isnan (limit) ? LAMINA_MOISTURE_DEFAULT_LIMIT : limit;
}

gboolean
lamina_library_set_moisture_limit (LaminaLibrary  *self,
                                   double          limit,
                                   GError        **error)
{
  char value[G_ASCII_DTOSTR_BUF_SIZE];

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), FALSE);
  BACKEND_OR_FAIL (self, error, FALSE);

  if (!LAMINA_MOISTURE_LIMIT_IS_VALID (limit))
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID,
                   "moisture limit: %g kg/m² is outside the allowed range above 0 to %g kg/m²",
                   limit, LAMINA_MOISTURE_LIMIT_MAX);
      return FALSE;
    }
  if (VT (self)->set_moisture_limit == NULL)
    {
      g_set_error_literal (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_FAILED,
                           "an office moisture limit is not supported by this library");
      return FALSE;
    }
  g_ascii_dtostr (value, sizeof value, limit);
  if (!VT (self)->set_moisture_limit (BE (self), value, limit, error))
    return FALSE;
  lamina_library_emit_changed (self);
  return TRUE;
}

LaminaSummaryFlags
lamina_library_moisture_flags_for_limit (const LaminaConstruction *c,
                                         double                    limit)
{
  g_autoptr(LaminaMoistureResult) result = NULL;

  if (c->moisture == NULL)
    return LAMINA_SUMMARY_NONE;
  result = lamina_moisture_calculate_own (c, limit, NULL);
  if (result == NULL || lamina_moisture_result_fails (result))
    return LAMINA_SUMMARY_HAS_MOISTURE | LAMINA_SUMMARY_MOISTURE_FAILS;
  return LAMINA_SUMMARY_HAS_MOISTURE;
}

LaminaSummaryFlags
lamina_library_moisture_flags (const LaminaConstruction *c)
{
  return lamina_library_moisture_flags_for_limit (c, NAN);
}
