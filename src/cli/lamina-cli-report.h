/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli-report.h: the text and JSON reports of a calculation, shared by
 * `calc` and `show` so that both print the same figures under the same keys. */
#pragma once

#include <json-glib/json-glib.h>
#include <stdio.h>

#include "lamina-calc.h"
#include "lamina-moisture.h"

G_BEGIN_DECLS

/* One object of the "constructions" array: unrounded figures in SI units
 * (thickness in m, R in m²·K/W, U in W/(m²·K)). */
JsonNode *lamina_cli_result_to_json   (const LaminaConstruction *construction,
                                       const LaminaResult       *result);
/* {"constructions": [...]} from an array of the objects above (takes it). */
char     *lamina_cli_json_document    (JsonArray                *constructions);
/* A member whose value may be missing: null for NAN (or ±inf, which JSON
 * cannot carry) and for a NULL string. */
void      lamina_cli_json_add_number  (JsonBuilder              *builder,
                                       const char               *key,
                                       double                    value);
void      lamina_cli_json_add_string  (JsonBuilder              *builder,
                                       const char               *key,
                                       const char               *value);
/* A readable table with the caution line. */
void      lamina_cli_print_result     (FILE                     *out,
                                       const LaminaConstruction *construction,
                                       const LaminaResult       *result);
/* The "moisture" object of a construction (EN ISO 13788), and its text. */
JsonNode *lamina_cli_moisture_to_json (const LaminaConstruction   *construction,
                                       const LaminaClimate        *climate,
                                       const LaminaMoistureResult *result);
void      lamina_cli_print_moisture   (FILE                       *out,
                                       const LaminaConstruction   *construction,
                                       const LaminaClimate        *climate,
                                       const LaminaMoistureResult *result);
/* For a construction carrying its climate data (from a library or a
 * catalogue): adds the "moisture" member to @construction_json (an object
 * from lamina_cli_result_to_json), or prints the block; nothing when it has
 * no check.  @limit: the office's, kg/m² (NAN: the default).  FALSE with
 * @error set when the check cannot be made. */
gboolean  lamina_cli_add_moisture     (JsonNode                 *construction_json,
                                       const LaminaConstruction *construction,
                                       double                    limit,
                                       GError                  **error);
gboolean  lamina_cli_print_moisture_own (FILE                   *out,
                                         const LaminaConstruction *construction,
                                         double                  limit,
                                         GError                **error);
/* Which method the figures above a caution come from. */
typedef enum
{
  LAMINA_CLI_CAUTION_LAYERS,  /* EN ISO 6946 */
  LAMINA_CLI_CAUTION_GROUND,  /* a ground floor's U with the ground, EN ISO 13370 */
  LAMINA_CLI_CAUTION_MIXED,   /* a list with both (a job) */
  LAMINA_CLI_CAUTION_FIELD,   /* the 2-D check, EN ISO 10211 */
} LaminaCliCaution;

/* The caution printed under every result, naming the method used. */
char       *lamina_cli_caution        (LaminaCliCaution method);
/* The "method" JSON value: the standard the reported U comes from. */
const char *lamina_cli_method         (gboolean ground);

G_END_DECLS
