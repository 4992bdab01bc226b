/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-construction-list.h: the library's constructions matching a
 * query, as a GListModel of LaminaConstructionItem.  Rows are fetched from
 * the store a page at a time when the view asks for them, so a list of
 * 10,000 constructions costs one COUNT and the visible pages. */
#pragma once

#include <gio/gio.h>

#include "store/lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_CONSTRUCTION_LIST (lamina_construction_list_get_type ())
G_DECLARE_FINAL_TYPE (LaminaConstructionList, lamina_construction_list, LAMINA, CONSTRUCTION_LIST, GObject)

#define LAMINA_CONSTRUCTION_LIST_PAGE 64
/* The count stops after this many rows ("1,000+ constructions"). */
#define LAMINA_CONSTRUCTION_LIST_COUNT_BOUND 1000

LaminaConstructionList *lamina_construction_list_new      (LaminaLibrary          *library);
/* The filters; each change refreshes the list.  NULL / −1 / NAN = any. */
void  lamina_construction_list_set_text     (LaminaConstructionList *self,
                                             const char             *text);
void  lamina_construction_list_set_element  (LaminaConstructionList *self,
                                             int                     element);
void  lamina_construction_list_set_status   (LaminaConstructionList *self,
                                             int                     status);
void  lamina_construction_list_set_tag      (LaminaConstructionList *self,
                                             const char             *tag);
void  lamina_construction_list_set_u_range  (LaminaConstructionList *self,
                                             double                  min_u,
                                             double                  max_u);
/* Only the constructions that fail their EN ISO 13788 check. */
void  lamina_construction_list_set_moisture_fails (LaminaConstructionList *self,
                                                   gboolean                only);
void  lamina_construction_list_set_sort     (LaminaConstructionList *self,
                                             LaminaSortKey           sort,
                                             gboolean                descending);
/* Re-reads the count and drops the cached pages. */
void  lamina_construction_list_refresh      (LaminaConstructionList *self);
/* Position of @id among the first few hundred rows, or −1. */
int   lamina_construction_list_find         (LaminaConstructionList *self,
                                             const char             *id);
/* A copy of the current query without paging (strings borrowed from
 * @self, valid until the next change). */
void  lamina_construction_list_get_query    (LaminaConstructionList *self,
                                             LaminaLibraryQuery     *query);
/* FALSE while the query matches more than COUNT_BOUND rows that were not
 * all counted: the list then holds COUNT_BOUND + 1 rows, and grows to the
 * full count when the view scrolls near its end or on
 * lamina_construction_list_count_exactly (items-changed at the end). */
gboolean lamina_construction_list_is_count_exact (LaminaConstructionList *self);
void  lamina_construction_list_count_exactly (LaminaConstructionList *self);
/* The last store error, or NULL. */
const char *lamina_construction_list_get_error (LaminaConstructionList *self);

G_END_DECLS
