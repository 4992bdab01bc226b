/* SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

#define LAMINA_CALC_ERROR (lamina_calc_error_quark ())

typedef enum
{
  LAMINA_CALC_ERROR_INVALID,     /* a value is out of range or missing */
  LAMINA_CALC_ERROR_UNSUPPORTED, /* outside what EN ISO 6946 covers */
  LAMINA_CALC_ERROR_UNREACHABLE, /* no thickness reaches a target */
} LaminaCalcError;

GQuark lamina_calc_error_quark (void);

G_END_DECLS
