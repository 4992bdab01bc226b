/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The rest of the method as pure edits (lamina-editor-state.h): a floor's
 * plan for EN ISO 13370, a tapered layer (EN ISO 6946 Annex E), an
 * unheated space outside (6.10) and the Annex C/D conditions.  Each returns
 * the new state, or NULL with the model's own message naming the field. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-editor-state.h"

#include <glib/gi18n.h>
#include <math.h>

/* The next state if it passes the model's checks. */
static LaminaConstruction *
checked (LaminaConstruction *next,
         GError            **error)
{
  g_autoptr(GError) local = NULL;

  if (lamina_construction_validate (next, NULL, &local))
    return next;
  g_set_error_literal (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID, local->message);
  lamina_construction_free (next);
  return NULL;
}

LaminaConstruction *
lamina_edit_set_ground (const LaminaConstruction *state,
                        const LaminaGround       *ground,
                        GError                  **error)
{
  LaminaConstruction *next;

  g_return_val_if_fail (state != NULL, NULL);

  next = lamina_construction_copy (state);
  next->has_ground = ground != NULL;
  if (ground != NULL)
    next->ground = *ground;
  else
    lamina_ground_init (&next->ground);
  return checked (next, error);
}

void
lamina_edit_default_ground (LaminaGround *ground)
{
  /* A start for the user to overwrite: a plan of B′ 5 m (100 m², 40 m of
   * exposed perimeter), 300 mm walls, soil not known. */
  lamina_ground_init (ground);
  ground->area = 100;
  ground->perimeter = 40;
  ground->wall_thickness = 300;
}

LaminaConstruction *
lamina_edit_set_taper (const LaminaConstruction *state,
                       int                       index,
                       LaminaTaper               taper,
                       double                    thickness_max,
                       GError                  **error)
{
  LaminaConstruction *next;

  g_return_val_if_fail (state != NULL, NULL);

  next = lamina_construction_copy (state);
  for (guint i = 0; i < next->layers->len; i++)
    {
      LaminaLayer *layer = next->layers->pdata[i];

      layer->taper = LAMINA_TAPER_NONE;
      layer->thickness_max = NAN;
    }
  if (index >= 0 && (guint) index < next->layers->len && taper != LAMINA_TAPER_NONE)
    {
      LaminaLayer *layer = next->layers->pdata[index];

      layer->taper = taper;
      layer->thickness_max = thickness_max;
    }
  return checked (next, error);
}

LaminaConstruction *
lamina_edit_set_unheated (const LaminaConstruction *state,
                          const LaminaUnheated     *unheated,
                          GError                  **error)
{
  LaminaConstruction *next;

  g_return_val_if_fail (state != NULL && unheated != NULL, NULL);

  next = lamina_construction_copy (state);
  next->unheated = *unheated;
  return checked (next, error);
}

LaminaConstruction *
lamina_edit_set_surfaces (const LaminaConstruction      *state,
                          const LaminaSurfaceConditions *surfaces,
                          GError                       **error)
{
  LaminaConstruction *next;

  g_return_val_if_fail (state != NULL && surfaces != NULL, NULL);

  next = lamina_construction_copy (state);
  next->surfaces = *surfaces;
  return checked (next, error);
}
