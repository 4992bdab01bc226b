/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The 2-D check (EN ISO 10211) stored with a revision: the front end
 * (JSON body, which revision, when to calculate). */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-library-backend.h"

#include <json-glib/json-glib.h>
#include <math.h>

void
lamina_field_check_free (LaminaFieldCheck *check)
{
  g_free (check);
}

LaminaFieldCheck *
lamina_field_check_new_from_result (const LaminaFieldResult *r,
                                    int                      revision)
{
  LaminaFieldCheck *check = g_new0 (LaminaFieldCheck, 1);

  check->revision = revision;
  check->u = r->u;
  check->u_6946 = r->u_6946;
  check->heat_flow = r->heat_flow;
  check->min_inner_surface_temperature = r->min_inner_surface_temperature;
  check->f_rsi = r->f_rsi;
  check->min_inner_surface_temperature_mould = r->min_inner_surface_temperature_mould;
  check->f_rsi_mould = r->f_rsi_mould;
  check->module_width = r->module_width;
  check->cells = r->cells;
  check->converged = r->refinement.converged;
  check->change = r->refinement.change;
  return check;
}

/* The body's keys follow the CLI's "field" object, plus the rest. */
static char *
check_to_json (const LaminaFieldCheck *c)
{
  g_autoptr(JsonBuilder) b = json_builder_new ();
  g_autoptr(JsonGenerator) generator = json_generator_new ();
  g_autoptr(JsonNode) root = NULL;
  const struct { const char *key; double value; } numbers[] = {
    { "u", c->u }, { "u_6946", c->u_6946 }, { "heat_flow", c->heat_flow },
    { "min_inner_surface_temperature", c->min_inner_surface_temperature }, { "f_rsi", c->f_rsi },
    { "min_inner_surface_temperature_mould", c->min_inner_surface_temperature_mould },
    { "f_rsi_mould", c->f_rsi_mould }, { "module_width", c->module_width }, { "change", c->change },
  };

  json_builder_begin_object (b);
  for (guint k = 0; k < G_N_ELEMENTS (numbers); k++)
    {
      json_builder_set_member_name (b, numbers[k].key);
      json_builder_add_double_value (b, numbers[k].value);
    }
  json_builder_set_member_name (b, "cells");
  json_builder_add_int_value (b, c->cells);
  json_builder_set_member_name (b, "converged");
  json_builder_add_boolean_value (b, c->converged);
  json_builder_end_object (b);
  root = json_builder_get_root (b);
  json_generator_set_root (generator, root);
  return json_generator_to_data (generator, NULL);
}

static LaminaFieldCheck *
check_from_json (const char  *body,
                 int          revision,
                 const char  *id,
                 GError     **error)
{
  g_autoptr(JsonParser) parser = json_parser_new ();
  g_autoptr(LaminaFieldCheck) check = g_new0 (LaminaFieldCheck, 1);
  JsonObject *o;

  if (!json_parser_load_from_data (parser, body, -1, NULL)
      || !JSON_NODE_HOLDS_OBJECT (json_parser_get_root (parser)))
    goto damaged;
  o = json_node_get_object (json_parser_get_root (parser));
  if (!json_object_has_member (o, "u") || !json_object_has_member (o, "cells"))
    goto damaged;
  check->revision = revision;
  check->u = json_object_get_double_member_with_default (o, "u", NAN);
  check->u_6946 = json_object_get_double_member_with_default (o, "u_6946", NAN);
  check->heat_flow = json_object_get_double_member_with_default (o, "heat_flow", NAN);
  check->min_inner_surface_temperature =
    json_object_get_double_member_with_default (o, "min_inner_surface_temperature", NAN);
  check->f_rsi = json_object_get_double_member_with_default (o, "f_rsi", NAN);
  check->min_inner_surface_temperature_mould =
    json_object_get_double_member_with_default (o, "min_inner_surface_temperature_mould", NAN);
  check->f_rsi_mould = json_object_get_double_member_with_default (o, "f_rsi_mould", NAN);
  check->module_width = json_object_get_double_member_with_default (o, "module_width", NAN);
  check->change = json_object_get_double_member_with_default (o, "change", NAN);
  check->cells = (guint) json_object_get_int_member_with_default (o, "cells", 0);
  check->converged = json_object_get_boolean_member_with_default (o, "converged", FALSE);
  return g_steal_pointer (&check);

damaged:
  g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_CORRUPT,
               "the stored 2-D check of “%s” revision %d is damaged", id, revision);
  return NULL;
}

/* The revision number @revision stands for (0: the latest). */
static int
resolve_revision (LaminaLibrary *self,
                  const char    *id,
                  int            revision,
                  GError       **error)
{
  g_autoptr(LaminaConstruction) c = NULL;

  if (revision > 0)
    return revision;
  c = VT (self)->get_construction (BE (self), id, 0, error);
  return c != NULL ? c->revision : 0;
}

LaminaFieldCheck *
lamina_library_dup_field_check (LaminaLibrary *self,
                                const char    *id,
                                int            revision,
                                GError       **error)
{
  g_autofree char *body = NULL;
  GError *local = NULL;
  int number;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self) && id != NULL, NULL);

  number = resolve_revision (self, id, revision, error);
  if (number <= 0)
    return NULL;
  body = VT (self)->get_field_check (BE (self), id, number, &local);
  if (body == NULL)
    {
      if (local != NULL)
        g_propagate_error (error, local);
      else
        g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                     "revision %d of “%s” has no 2-D check", number, id);
      return NULL;
    }
  return check_from_json (body, number, id, error);
}

gboolean
lamina_library_has_field_check (LaminaLibrary *self,
                                const char    *id,
                                int            revision)
{
  g_autoptr(LaminaFieldCheck) check = lamina_library_dup_field_check (self, id, revision, NULL);

  return check != NULL;
}

gboolean
lamina_library_put_field_check (LaminaLibrary           *self,
                                const char              *id,
                                int                      revision,
                                const LaminaFieldResult *result,
                                GError                 **error)
{
  g_autoptr(LaminaFieldCheck) check = NULL;
  g_autofree char *body = NULL;
  g_autofree char *now = lamina_library_dup_now ();

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self) && id != NULL && result != NULL, FALSE);
  g_return_val_if_fail (revision > 0, FALSE);

  check = lamina_field_check_new_from_result (result, revision);
  body = check_to_json (check);
  if (!VT (self)->put_field_check (BE (self), id, revision, body, now, error))
    return FALSE;
  lamina_library_emit_changed (self);
  return TRUE;
}

LaminaFieldCheck *
lamina_library_refresh_field_check (LaminaLibrary       *self,
                                    const char          *id,
                                    LaminaFieldProgress  progress,
                                    gpointer             user_data,
                                    LaminaFieldResult  **result,
                                    GError             **error)
{
  g_autoptr(LaminaConstruction) c = NULL;
  g_autoptr(LaminaFieldResult) calculated = NULL;
  LaminaFieldCheck *check;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self) && id != NULL, NULL);

  if (result != NULL)
    *result = NULL;
  c = VT (self)->get_construction (BE (self), id, 0, error);
  if (c == NULL)
    return NULL;
  check = lamina_library_dup_field_check (self, id, c->revision, NULL);
  if (check != NULL)
    return check;
  calculated = lamina_field_calculate (c, 0, progress, user_data, error);
  if (calculated == NULL
      || !lamina_library_put_field_check (self, id, c->revision, calculated, error))
    return NULL;
  check = lamina_field_check_new_from_result (calculated, c->revision);
  if (result != NULL)
    *result = g_steal_pointer (&calculated);
  return check;
}
