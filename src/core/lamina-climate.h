/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-climate.h: the external climate of a site as twelve monthly means
 * (EN ISO 13788:2012 4.2), which a construction's moisture check refers to
 * by id. */
#pragma once

#include <glib-object.h>

G_BEGIN_DECLS

#define LAMINA_MONTHS 12

typedef struct
{
  char   *id;
  char   *name;
  char   *source;                        /* where the figures come from */
  double  temperature[LAMINA_MONTHS];    /* θe, °C, January first */
  double  humidity[LAMINA_MONTHS];       /* φe, 0–1 */
  int     line;                          /* source line for messages, 0 if none */
} LaminaClimate;

#define LAMINA_TYPE_CLIMATE (lamina_climate_get_type ())
GType          lamina_climate_get_type (void) G_GNUC_CONST;

/* Every month NAN until given. */
LaminaClimate *lamina_climate_new      (const char          *id,
                                        const char          *name);
LaminaClimate *lamina_climate_copy     (const LaminaClimate *climate);
void           lamina_climate_free     (LaminaClimate       *climate);
/* Same id, name, source and figures; ignores source lines. */
gboolean       lamina_climate_equal    (const LaminaClimate *a,
                                        const LaminaClimate *b);
/* Every month given and in range (θe −60…60 °C, φe 0…1); the message names
 * the climate and the month (LAMINA_CALC_ERROR_INVALID). */
gboolean       lamina_climate_validate (const LaminaClimate *climate,
                                        GError             **error);
/* The days of month @month (1–12) in a non-leap year. */
int            lamina_month_days       (int                  month);
/* The translated name of month @month (1–12). */
const char    *lamina_month_name       (int                  month);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaClimate, lamina_climate_free)

G_END_DECLS
