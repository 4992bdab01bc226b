/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-library-backend.h: the seam behind LaminaLibrary (private to
 * src/store).  LaminaLibrary checks arguments, fills in who and when,
 * calculates figures and emits "changed"; a backend only stores.  Today
 * there is one backend (lamina-sqlite-*.c); a server backend implements
 * the same table. */
#pragma once

#include "lamina-library.h"

G_BEGIN_DECLS

typedef struct _LaminaBackend LaminaBackend;

/* What the front end hands the backend with every stored revision. */
typedef struct
{
  const LaminaConstruction *construction;  /* id, content, review data */
  const LaminaResult       *result;        /* NULL if not calculable */
  const char               *calc_error;    /* why not, or NULL */
  const char               *comment;
} LaminaBackendRevision;

typedef struct
{
  void                (*close)              (LaminaBackend *backend);
  gboolean            (*check_for_changes)  (LaminaBackend *backend);

  GPtrArray          *(*list_materials)     (LaminaBackend *backend, GError **error);
  LaminaMaterial     *(*get_material)       (LaminaBackend *backend, const char *id,
                                             GError **error);
  gboolean            (*put_material)       (LaminaBackend *backend,
                                             const LaminaMaterial *material,
                                             const char *now, GError **error);

  LaminaConstruction *(*get_construction)   (LaminaBackend *backend, const char *id,
                                             int revision, GError **error);
  /* Adds revision @base_revision + 1 of an existing construction
   * (@base_revision 0: creates it, refused with EXISTS if taken). */
  gboolean            (*store_revision)     (LaminaBackend *backend,
                                             const LaminaBackendRevision *rev,
                                             int base_revision, GError **error);
  gboolean            (*set_deleted)        (LaminaBackend *backend, const char *id,
                                             const char *when, GError **error);
  GPtrArray          *(*get_history)        (LaminaBackend *backend, const char *id,
                                             GError **error);
  /* Moves the latest revision (@revision) to @status with who/when. */
  gboolean            (*set_status)         (LaminaBackend *backend, const char *id,
                                             int revision, LaminaStatus status,
                                             const char *name, const char *when,
                                             GError **error);

  GPtrArray          *(*search)             (LaminaBackend *backend,
                                             const LaminaLibraryQuery *query,
                                             GError **error);
  gint64              (*count)              (LaminaBackend *backend,
                                             const LaminaLibraryQuery *query,
                                             GError **error);
  GPtrArray          *(*list_tags)          (LaminaBackend *backend, GError **error);

  /* All of @revisions and @materials in one transaction, or nothing. */
  gboolean            (*apply_import)       (LaminaBackend *backend,
                                             GPtrArray *materials,
                                             GPtrArray *revisions,
                                             const GArray *base_revisions,
                                             const char *now, GError **error);
  /* Ids of every live construction, sorted by code. */
  GPtrArray          *(*list_ids)           (LaminaBackend *backend, GError **error);
} LaminaBackendVTable;

struct _LaminaBackend
{
  const LaminaBackendVTable *vtable;
  char                      *path;
  char                      *backup_path;
  int                        opened_version;
};

/* lamina-library-types.c */
LaminaImportReport *lamina_import_report_new (void);

/* lamina-library.c, for lamina-library-exchange.c */
LaminaBackend *lamina_library_get_backend  (LaminaLibrary *self);
char          *lamina_library_dup_now      (void);
const char    *lamina_library_default_author (const char *author);
/* Fills in figures, the id and revision, and who and when; stores. */
gboolean       lamina_library_prepare_revision (LaminaConstruction *construction,
                                                LaminaResult      **result,
                                                char              **calc_error);
/* Makes @c draft revision @revision by @author (NULL: the user), now. */
void           lamina_library_set_new_draft (LaminaConstruction *c,
                                             int                 revision,
                                             const char         *author);
void           lamina_library_emit_changed (LaminaLibrary *self);

/* For the front end's files: the library's backend and its table, and
 * the refusal of every operation on a closed library. */
#define BE(self) (lamina_library_get_backend (self))
#define VT(self) (BE (self)->vtable)
#define BACKEND_OR_FAIL(self, error, value)                                     \
  G_STMT_START {                                                                \
    if (BE (self) == NULL)                                                      \
      {                                                                         \
        g_set_error_literal ((error), LAMINA_LIBRARY_ERROR,                     \
                             LAMINA_LIBRARY_ERROR_IO, "the library is closed"); \
        return (value);                                                         \
      }                                                                         \
  } G_STMT_END

/* lamina-sqlite-open.c */
LaminaBackend *lamina_sqlite_backend_open (const char             *path,
                                           LaminaLibraryOpenFlags  flags,
                                           GError                **error);

G_END_DECLS
