/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-window-private.h: shared by lamina-window*.c. */
#pragma once

#include "lamina-change-banner.h"
#include "lamina-document.h"
#include "lamina-window.h"
#include "lamina-write-gate.h"

G_BEGIN_DECLS

struct _LaminaWindow
{
  GtkApplicationWindow    parent_instance;

  /* template */
  GtkRevealer            *banner_revealer;
  GtkLabel               *banner_label;
  GtkPaned               *paned;
  GtkSearchEntry         *search_entry;
  GtkDropDown            *element_filter;
  GtkDropDown            *status_filter;
  GtkDropDown            *sort_dropdown;
  GtkDropDown            *tag_filter;
  GtkCheckButton         *moisture_filter;
  GtkEntry               *min_u_entry;
  GtkEntry               *max_u_entry;
  GtkListView            *list_view;
  GtkLabel               *count_label;
  GtkFlowBox             *filter_chips;
  GtkStack               *main_stack;
  LaminaEditor           *editor;
  GtkRevealer            *toast_revealer;
  GtkLabel               *toast_label;
  GtkWidget              *toast_undo;
  GtkWidget              *demo_button;
  GtkStack               *view_stack;
  LaminaJobsPage         *jobs_page;

  /* owned */
  LaminaLibrary          *library;
  LaminaConstructionList *list;
  GtkSingleSelection     *selection;
  LaminaDocument         *document;
  GSettings              *settings;
  GPtrArray              *tags;
  gboolean                tags_loaded; /* on first use of the tag filter */
  GCancellable           *cancellable;
  char                   *deleted_id;
  gboolean                import_keep_review;  /* the import dialog's choice */
  char                   *notice;
  guint                   toast_timeout;
  guint                   refresh_idle;
  guint                   poll_timeout;
  /* Typing: the search runs once the keystrokes queued so far are in. */
  guint                   search_idle;
  /* Live constructions in the library for "4 of 20", or −1: read again
   * after the library changed. */
  gint64                  library_total;
  gboolean                selecting;
  /* "changed underneath" for the open construction */
  LaminaChangeBanner     *change_banner;
  gboolean                external_change; /* since the last refresh */
  /* Writes while another program holds the library's write lock, and the
   * documents whose edits wait there (id → LaminaDocument), so that
   * opening one again shows the edits that wait. */
  LaminaWriteGate        *write_gate;
  GHashTable             *held_documents;
  gpointer                import;      /* the import running, or NULL */
};

/* lamina-window-import.c */
typedef enum
{
  LAMINA_IMPORT_PHASE_NONE = -1,
  LAMINA_IMPORT_PHASE_READING,   /* reading and checking the document */
  LAMINA_IMPORT_PHASE_WAITING,   /* for another program's write lock */
  LAMINA_IMPORT_PHASE_WRITING,   /* one transaction: cannot be stopped */
} LaminaImportPhase;

/* Imports @path in a worker thread with a progress window and Cancel,
 * then shows the report or the refusal. */
void              lamina_window_import_file       (LaminaWindow      *self,
                                                   const char        *path,
                                                   LaminaImportFlags  flags,
                                                   const char        *author);
LaminaImportPhase lamina_window_get_import_phase  (LaminaWindow      *self);
/* What the progress window's Cancel does (before the write). */
void              lamina_window_cancel_import     (LaminaWindow      *self);
void              lamina_window_show_import_report (LaminaWindow             *self,
                                                    const LaminaImportReport *report);

void lamina_window_update_actions   (LaminaWindow *self);
/* What the window's timer does: asks the library whether another process
 * or connection wrote (rows, the open construction's banner). */
void lamina_window_poll_library     (LaminaWindow *self);
void lamina_window_refresh_list     (LaminaWindow *self);
void lamina_window_install_actions  (GtkWidgetClass *widget_class);
/* lamina-window-writes.c: the window's writes through its write gate. */
void lamina_window_watch_document   (LaminaWindow   *self,
                                     LaminaDocument *document);
/* The document of @id whose edits wait for the library, or NULL. */
LaminaDocument *lamina_window_dup_held_document (LaminaWindow *self,
                                                 const char   *id);
/* FALSE, with a message, while writes wait: review acts are refused then
 * (they must name the revision that the waiting edits will make). */
gboolean lamina_window_check_no_waiting_writes (LaminaWindow *self);
void lamina_window_check_revision   (LaminaWindow   *self,
                                     const char     *id,
                                     int             revision,
                                     const char     *reviewer);
void lamina_window_delete_construction (LaminaWindow *self,
                                        const char   *id,
                                        const char   *reviewer,
                                        const char   *message);
void lamina_window_restore_construction (LaminaWindow *self,
                                         const char   *id);
/* lamina-window-design.c */
void lamina_window_install_design_actions (GtkWidgetClass *widget_class);
/* The library filtered to @element and corrected U ≤ @target, thinnest
 * first. */
void lamina_window_show_meeting (LaminaWindow  *self,
                                 LaminaElement  element,
                                 double         target);
/* Opens the comparison of the open construction: against its latest
 * approved revision when @with_approved and there is one, else with B to
 * be chosen. */
struct _LaminaCompareWindow *lamina_window_compare (LaminaWindow *self,
                                                    gboolean      with_approved);
/* lamina-window-export.c */
void lamina_window_install_export_actions (GtkWidgetClass *widget_class);
/* The listed constructions' catalogue written in a worker thread;
 * @bar (may be NULL) shows the progress.  Cancelling stops at the next
 * construction and writes nothing (G_IO_ERROR_CANCELLED). */
void     lamina_window_export_catalogue_async  (LaminaWindow        *self,
                                                const char          *path,
                                                GtkProgressBar      *bar,
                                                GCancellable        *cancellable,
                                                GAsyncReadyCallback  callback,
                                                gpointer             user_data);
gboolean lamina_window_export_catalogue_finish (LaminaWindow        *self,
                                                GAsyncResult        *result,
                                                GError             **error);
void lamina_window_show_undo_delete (LaminaWindow *self,
                                     const char   *message,
                                     const char   *id);

G_END_DECLS
