/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-library.c: LaminaLibrary, the front of the office library.  It
 * checks arguments, fills in who and when, calculates every revision with
 * lamina_calculate and hands the result to the backend to store. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-library.h"

#include <math.h>

#include "lamina-library-backend.h"
#include "lamina-library-safety.h"

struct _LaminaLibrary
{
  GObject        parent_instance;

  /* owned */
  LaminaBackend *backend;

  /* lamina_library_set_wait_func: told while a write waits for another
   * program's lock (the backend calls wait_trampoline). */
  LaminaLibraryWaitFunc wait_func;
  gpointer              wait_data;
};

G_DEFINE_FINAL_TYPE (LaminaLibrary, lamina_library, G_TYPE_OBJECT)

enum
{
  CHANGED,
  N_SIGNALS
};

static guint signals[N_SIGNALS];

static void
wait_trampoline (gpointer    data,
                 gboolean    waiting,
                 const char *holder)
{
  LaminaLibrary *self = data;

  if (self->wait_func != NULL)
    self->wait_func (self, waiting, holder, self->wait_data);
}

void
lamina_library_set_wait_func (LaminaLibrary        *self,
                              LaminaLibraryWaitFunc func,
                              gpointer              user_data)
{
  g_return_if_fail (LAMINA_IS_LIBRARY (self));
  if (self->backend == NULL)
    return;
  self->wait_func = func;
  self->wait_data = user_data;
  self->backend->waiting = func != NULL ? wait_trampoline : NULL;
  self->backend->waiting_data = func != NULL ? self : NULL;
}

static void
lamina_library_finalize (GObject *object)
{
  lamina_library_close (LAMINA_LIBRARY (object));
  G_OBJECT_CLASS (lamina_library_parent_class)->finalize (object);
}

static void
lamina_library_class_init (LaminaLibraryClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);

  object_class->finalize = lamina_library_finalize;

  signals[CHANGED] = g_signal_new ("changed", G_TYPE_FROM_CLASS (klass),
                                   G_SIGNAL_RUN_LAST, 0, NULL, NULL, NULL,
                                   G_TYPE_NONE, 0);
}

static void
lamina_library_init (LaminaLibrary *self)
{
}

char *
lamina_library_dup_default_path (void)
{
  return g_build_filename (g_get_user_data_dir (), "lamina", "library.sqlite", NULL);
}

LaminaLibrary *
lamina_library_open (const char             *path,
                     LaminaLibraryOpenFlags  flags,
                     GError                **error)
{
  return lamina_library_open_with_password (path, NULL, flags, error);
}

LaminaLibrary *
lamina_library_open_with_password (const char             *path,
                                   const char             *password,
                                   LaminaLibraryOpenFlags  flags,
                                   GError                **error)
{
  g_autofree char *default_path = NULL;
  LaminaBackend *backend;
  LaminaLibrary *self;

  if (path == NULL)
    path = default_path = lamina_library_dup_default_path ();
  if (lamina_library_is_server_address (path))
    backend = lamina_pg_backend_open (path, password, flags, error);
  else
    backend = lamina_sqlite_backend_open (path, flags, error);
  if (backend == NULL)
    return NULL;
  self = g_object_new (LAMINA_TYPE_LIBRARY, NULL);
  self->backend = backend;
  return self;
}

void
lamina_library_close (LaminaLibrary *self)
{
  g_return_if_fail (LAMINA_IS_LIBRARY (self));

  if (self->backend != NULL)
    {
      VT (self)->close (self->backend);
      self->backend = NULL;
    }
}

gboolean
lamina_library_server_init (LaminaLibrary  *self,
                            GError        **error)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), FALSE);
  BACKEND_OR_FAIL (self, error, FALSE);
  if (VT (self)->server_init == NULL)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_FAILED,
                   "%s: not supported by this library (server roles need a library on a "
                   "PostgreSQL server; a file's readers and writers are set by its folder's "
                   "permissions)", BE (self)->path);
      return FALSE;
    }
  if (!VT (self)->server_init (BE (self), error))
    return FALSE;
  lamina_library_emit_changed (self);
  return TRUE;
}

LaminaBackend *
lamina_library_get_backend (LaminaLibrary *self)
{
  return self->backend;
}

const char *
lamina_library_get_path (LaminaLibrary *self)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  return self->backend ? self->backend->path : NULL;
}

const char *
lamina_library_get_backup_path (LaminaLibrary *self)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  return self->backend ? self->backend->backup_path : NULL;
}

int
lamina_library_get_opened_version (LaminaLibrary *self)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), -1);
  return self->backend ? self->backend->opened_version : -1;
}

void
lamina_library_emit_changed (LaminaLibrary *self)
{
  /* Our own write moved data_version: swallow it, we emit here. */
  VT (self)->check_for_changes (self->backend);
  g_signal_emit (self, signals[CHANGED], 0);
}

gboolean
lamina_library_check_for_changes (LaminaLibrary *self)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), FALSE);

  if (self->backend == NULL || !VT (self)->check_for_changes (self->backend))
    return FALSE;
  g_signal_emit (self, signals[CHANGED], 0);
  return TRUE;
}

char *
lamina_library_dup_now (void)
{
  g_autoptr(GDateTime) now = g_date_time_new_now_utc ();

  return g_date_time_format (now, "%Y-%m-%dT%H:%M:%SZ");
}

const char *
lamina_library_default_author (const char *author)
{
  if (author != NULL && *author != '\0')
    return author;
  return g_get_user_name ();
}

/* Materials */

GPtrArray *
lamina_library_list_materials (LaminaLibrary  *self,
                               GError        **error)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  BACKEND_OR_FAIL (self, error, NULL);
  return VT (self)->list_materials (self->backend, error);
}

LaminaMaterial *
lamina_library_dup_material (LaminaLibrary  *self,
                             const char     *id,
                             GError        **error)
{
  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), NULL);
  g_return_val_if_fail (id != NULL, NULL);
  BACKEND_OR_FAIL (self, error, NULL);
  return VT (self)->get_material (self->backend, id, error);
}

gboolean
lamina_library_put_material (LaminaLibrary   *self,
                             LaminaMaterial  *material,
                             GError         **error)
{
  g_autofree char *now = lamina_library_dup_now ();

  g_return_val_if_fail (LAMINA_IS_LIBRARY (self), FALSE);
  g_return_val_if_fail (material != NULL, FALSE);
  BACKEND_OR_FAIL (self, error, FALSE);

  if (material->name == NULL || *material->name == '\0')
    {
      g_set_error_literal (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID,
                           "material name: required");
      return FALSE;
    }
  /* Look-alike ids: NFC, and no control or format characters. */
  if (!lamina_library_clean_material_identity (material, NULL, error))
    return FALSE;
  if (!(material->conductivity > 0) || !isfinite (material->conductivity))
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID,
                   "material “%s”, conductivity λ: must be a number above 0 W/(m·K)",
                   material->name);
      return FALSE;
    }
  if (material->id == NULL)
    material->id = g_uuid_string_random ();
  if (!VT (self)->put_material (self->backend, material, now, error))
    return FALSE;
  lamina_library_emit_changed (self);
  return TRUE;
}

