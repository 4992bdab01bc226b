/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-window-work.h: library work that may take long (re-flagging a
 * whole library after a material or climate change) run off the main
 * thread.  A LaminaLibrary is used from one thread only, so the work runs
 * on a connection of its own to the same library, opened here and closed
 * in the worker; the window's own connection is told to look for the
 * change when the work is done.  A library that cannot be opened a second
 * time is worked on the spot (the caller's thread) as before. */
#pragma once

#include <gio/gio.h>

#include "store/lamina-library.h"

G_BEGIN_DECLS

/* The work: runs in the worker on @library (the worker's connection). */
typedef gboolean (*LaminaLibraryWorkFunc) (LaminaLibrary  *library,
                                           gpointer        data,
                                           GCancellable   *cancellable,
                                           GError        **error);

/* Runs @func (@data, freed by @data_free when done) for @library and
 * calls @callback on the calling thread's main context.  Reading work
 * runs on a read-only library too; a write there fails with the library's
 * READ_ONLY error. */
void     lamina_library_work_run_async (LaminaLibrary         *library,
                                        LaminaLibraryWorkFunc  func,
                                        gpointer               data,
                                        GDestroyNotify         data_free,
                                        gpointer               source_object,
                                        GCancellable          *cancellable,
                                        GAsyncReadyCallback    callback,
                                        gpointer               user_data);
/* The work's result; @library's own connection has looked for the
 * change already. */
gboolean lamina_library_work_finish    (GAsyncResult          *result,
                                        GError               **error);
/* The data given to _run_async, for the callback. */
gpointer lamina_library_work_get_data  (GAsyncResult          *result);

G_END_DECLS
