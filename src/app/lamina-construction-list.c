/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "lamina-construction-list.h"

#include <math.h>

#include "lamina-construction-item.h"

/* Pages kept; a page is dropped at random beyond this (the view only asks
 * for what is on screen, so the cache stays small). */
#define MAX_PAGES 32
/* How far lamina_construction_list_find looks. */
#define FIND_PAGES 8

struct _LaminaConstructionList
{
  GObject             parent_instance;

  /* owned */
  LaminaLibrary      *library;
  LaminaLibraryQuery  query;
  char               *text;
  char               *tag;
  GHashTable         *pages;   /* page number → GPtrArray of items */
  guint               n_items;
  gboolean            count_exact;  /* FALSE: more than COUNT_BOUND, not counted */
  guint               count_idle;
  char               *error;
};

static void lamina_construction_list_iface_init (GListModelInterface *iface);

G_DEFINE_FINAL_TYPE_WITH_CODE (LaminaConstructionList, lamina_construction_list, G_TYPE_OBJECT,
                               G_IMPLEMENT_INTERFACE (G_TYPE_LIST_MODEL,
                                                      lamina_construction_list_iface_init))

static void
set_error (LaminaConstructionList *self,
           const GError           *error)
{
  g_free (self->error);
  self->error = error ? g_strdup (error->message) : NULL;
  if (error != NULL)
    g_warning ("Library list: %s", error->message);
}

/* Pages @first … @first + @n_pages − 1 in one query (one walk of the sort
 * order, not one per page); returns page @first. */
static GPtrArray *
fetch_pages (LaminaConstructionList *self,
             guint                   first,
             guint                   n_pages)
{
  g_autoptr(GPtrArray) summaries = NULL;
  g_autoptr(GError) error = NULL;
  LaminaLibraryQuery query = self->query;
  GPtrArray *items = NULL;

  query.offset = first * LAMINA_CONSTRUCTION_LIST_PAGE;
  query.limit = n_pages * LAMINA_CONSTRUCTION_LIST_PAGE;
  summaries = lamina_library_search (self->library, &query, &error);
  if (summaries == NULL)
    {
      set_error (self, error);
      return NULL;
    }
  if (g_hash_table_size (self->pages) + n_pages > MAX_PAGES)
    g_hash_table_remove_all (self->pages);
  for (guint p = 0; p < n_pages; p++)
    {
      GPtrArray *page = g_ptr_array_new_with_free_func (g_object_unref);

      for (guint i = p * LAMINA_CONSTRUCTION_LIST_PAGE;
           i < summaries->len && i < (p + 1) * LAMINA_CONSTRUCTION_LIST_PAGE; i++)
        g_ptr_array_add (page, lamina_construction_item_new (g_steal_pointer (&summaries->pdata[i])));
      g_hash_table_insert (self->pages, GUINT_TO_POINTER (first + p), page);
      if (p == 0)
        items = page;
    }
  /* The summaries array owns nothing now. */
  g_ptr_array_set_free_func (summaries, NULL);
  return items;
}

static GPtrArray *
fetch_page (LaminaConstructionList *self,
            guint                   page)
{
  return fetch_pages (self, page, 1);
}

static gboolean
count_exactly_cb (gpointer data)
{
  LaminaConstructionList *self = data;

  self->count_idle = 0;
  lamina_construction_list_count_exactly (self);
  return G_SOURCE_REMOVE;
}

static GType
lamina_construction_list_get_item_type (GListModel *model)
{
  return LAMINA_TYPE_CONSTRUCTION_ITEM;
}

static guint
lamina_construction_list_get_n_items (GListModel *model)
{
  return LAMINA_CONSTRUCTION_LIST (model)->n_items;
}

static gpointer
lamina_construction_list_get_item (GListModel *model,
                                   guint       position)
{
  LaminaConstructionList *self = LAMINA_CONSTRUCTION_LIST (model);
  guint page = position / LAMINA_CONSTRUCTION_LIST_PAGE;
  guint index = position % LAMINA_CONSTRUCTION_LIST_PAGE;
  GPtrArray *items;

  if (position >= self->n_items)
    return NULL;
  /* Scrolled near the end of a count that stopped early: count them all
   * (after this call: the view is asking for items now). */
  if (!self->count_exact && self->count_idle == 0
      && position + LAMINA_CONSTRUCTION_LIST_PAGE >= self->n_items)
    self->count_idle = g_idle_add_full (G_PRIORITY_DEFAULT_IDLE, count_exactly_cb,
                                        g_object_ref (self), g_object_unref);
  items = g_hash_table_lookup (self->pages, GUINT_TO_POINTER (page));
  if (items == NULL)
    items = fetch_page (self, page);
  if (items == NULL || index >= items->len)
    return NULL;
  return g_object_ref (g_ptr_array_index (items, index));
}

static void
lamina_construction_list_iface_init (GListModelInterface *iface)
{
  iface->get_item_type = lamina_construction_list_get_item_type;
  iface->get_n_items = lamina_construction_list_get_n_items;
  iface->get_item = lamina_construction_list_get_item;
}

static void
lamina_construction_list_finalize (GObject *object)
{
  LaminaConstructionList *self = LAMINA_CONSTRUCTION_LIST (object);

  g_clear_handle_id (&self->count_idle, g_source_remove);
  g_clear_object (&self->library);
  g_clear_pointer (&self->text, g_free);
  g_clear_pointer (&self->tag, g_free);
  g_clear_pointer (&self->pages, g_hash_table_unref);
  g_clear_pointer (&self->error, g_free);

  G_OBJECT_CLASS (lamina_construction_list_parent_class)->finalize (object);
}

static void
lamina_construction_list_class_init (LaminaConstructionListClass *klass)
{
  G_OBJECT_CLASS (klass)->finalize = lamina_construction_list_finalize;
}

static void
lamina_construction_list_init (LaminaConstructionList *self)
{
  self->pages = g_hash_table_new_full (NULL, NULL, NULL, (GDestroyNotify) g_ptr_array_unref);
  lamina_library_query_init (&self->query);
}

LaminaConstructionList *
lamina_construction_list_new (LaminaLibrary *library)
{
  LaminaConstructionList *self;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (library), NULL);

  self = g_object_new (LAMINA_TYPE_CONSTRUCTION_LIST, NULL);
  self->library = g_object_ref (library);
  lamina_construction_list_refresh (self);
  return self;
}

void
lamina_construction_list_refresh (LaminaConstructionList *self)
{
  g_autoptr(GError) error = NULL;
  guint old = self->n_items;
  gint64 count;

  g_return_if_fail (LAMINA_IS_CONSTRUCTION_LIST (self));

  g_hash_table_remove_all (self->pages);
  g_clear_handle_id (&self->count_idle, g_source_remove);
  self->query.text = self->text;
  self->query.tag = self->tag;
  self->query.offset = 0;
  self->query.limit = 0;
  /* A short prefix can match most of a large library: the count stops
   * after COUNT_BOUND ("1,000+"); the rest is counted when the view
   * scrolls near the end or on demand. */
  count = lamina_library_count_at_most (self->library, &self->query,
                                        LAMINA_CONSTRUCTION_LIST_COUNT_BOUND, &error);
  set_error (self, count < 0 ? error : NULL);
  self->count_exact = count <= LAMINA_CONSTRUCTION_LIST_COUNT_BOUND;
  /* Two steps, not one: on a single (0, old, new) change GTK 4.8's list
   * item manager looks through every added row for the widgets it
   * removed, which fetches the whole result page by page (hundreds of ms
   * at 10,000 rows).  Removing first leaves it nothing to look for. */
  self->n_items = 0;
  if (old != 0)
    g_list_model_items_changed (G_LIST_MODEL (self), 0, old, 0);
  self->n_items = count < 0 ? 0 : (guint) count;
  if (self->n_items != 0)
    g_list_model_items_changed (G_LIST_MODEL (self), 0, 0, self->n_items);
}

static void
replace_string (char       **field,
                const char  *value)
{
  g_free (*field);
  *field = value != NULL && *value ? g_strdup (value) : NULL;
}

void
lamina_construction_list_set_text (LaminaConstructionList *self,
                                   const char             *text)
{
  g_return_if_fail (LAMINA_IS_CONSTRUCTION_LIST (self));
  if (g_strcmp0 (self->text, text) == 0)
    return;
  replace_string (&self->text, text);
  /* Text search ranks by relevance when the user has not chosen a sort. */
  lamina_construction_list_refresh (self);
}

void
lamina_construction_list_set_element (LaminaConstructionList *self,
                                      int                     element)
{
  g_return_if_fail (LAMINA_IS_CONSTRUCTION_LIST (self));
  if (self->query.element == element)
    return;
  self->query.element = element;
  lamina_construction_list_refresh (self);
}

void
lamina_construction_list_set_status (LaminaConstructionList *self,
                                     int                     status)
{
  g_return_if_fail (LAMINA_IS_CONSTRUCTION_LIST (self));
  if (self->query.status == status)
    return;
  self->query.status = status;
  lamina_construction_list_refresh (self);
}

void
lamina_construction_list_set_tag (LaminaConstructionList *self,
                                  const char             *tag)
{
  g_return_if_fail (LAMINA_IS_CONSTRUCTION_LIST (self));
  if (g_strcmp0 (self->tag, tag) == 0)
    return;
  replace_string (&self->tag, tag);
  lamina_construction_list_refresh (self);
}

static gboolean
same_value (double a,
            double b)
{
  return (isnan (a) && isnan (b)) || a == b;
}

void
lamina_construction_list_set_u_range (LaminaConstructionList *self,
                                      double                  min_u,
                                      double                  max_u)
{
  g_return_if_fail (LAMINA_IS_CONSTRUCTION_LIST (self));
  if (same_value (self->query.min_u, min_u) && same_value (self->query.max_u, max_u))
    return;
  self->query.min_u = min_u;
  self->query.max_u = max_u;
  lamina_construction_list_refresh (self);
}

void
lamina_construction_list_set_moisture_fails (LaminaConstructionList *self,
                                             gboolean                only)
{
  g_return_if_fail (LAMINA_IS_CONSTRUCTION_LIST (self));
  if (self->query.moisture_fails_only == !!only)
    return;
  self->query.moisture_fails_only = !!only;
  lamina_construction_list_refresh (self);
}

void
lamina_construction_list_set_sort (LaminaConstructionList *self,
                                   LaminaSortKey           sort,
                                   gboolean                descending)
{
  g_return_if_fail (LAMINA_IS_CONSTRUCTION_LIST (self));
  if (self->query.sort == sort && self->query.descending == descending)
    return;
  self->query.sort = sort;
  self->query.descending = descending;
  lamina_construction_list_refresh (self);
}

int
lamina_construction_list_find (LaminaConstructionList *self,
                               const char             *id)
{
  g_return_val_if_fail (LAMINA_IS_CONSTRUCTION_LIST (self), -1);

  /* Page by page from the top, as the view would: the open construction
   * is nearly always near the rows on screen.  Bounded, so that a search
   * that pushes it far down costs a few pages, not the whole result. */
  for (guint page = 0; page < FIND_PAGES && page * LAMINA_CONSTRUCTION_LIST_PAGE < self->n_items; page++)
    {
      GPtrArray *items = g_hash_table_lookup (self->pages, GUINT_TO_POINTER (page));

      /* The pages not yet read, in one query. */
      if (items == NULL)
        items = fetch_pages (self, page, FIND_PAGES - page);
      for (guint i = 0; items != NULL && i < items->len; i++)
        if (g_strcmp0 (lamina_construction_item_get_id (items->pdata[i]), id) == 0)
          return (int) (page * LAMINA_CONSTRUCTION_LIST_PAGE + i);
    }
  return -1;
}

void
lamina_construction_list_get_query (LaminaConstructionList *self,
                                    LaminaLibraryQuery     *query)
{
  g_return_if_fail (LAMINA_IS_CONSTRUCTION_LIST (self));
  *query = self->query;
  query->offset = 0;
  query->limit = 0;
}

gboolean
lamina_construction_list_is_count_exact (LaminaConstructionList *self)
{
  g_return_val_if_fail (LAMINA_IS_CONSTRUCTION_LIST (self), TRUE);
  return self->count_exact;
}

void
lamina_construction_list_count_exactly (LaminaConstructionList *self)
{
  g_autoptr(GError) error = NULL;
  gint64 count;
  guint old;

  g_return_if_fail (LAMINA_IS_CONSTRUCTION_LIST (self));
  g_clear_handle_id (&self->count_idle, g_source_remove);
  if (self->count_exact)
    return;
  count = lamina_library_count (self->library, &self->query, &error);
  if (count < 0)
    {
      set_error (self, error);
      return;
    }
  self->count_exact = TRUE;
  old = self->n_items;
  if (count > old)
    {
      self->n_items = (guint) count;
      g_list_model_items_changed (G_LIST_MODEL (self), old, 0, self->n_items - old);
    }
  else if (count < old)
    {
      /* Cannot be fewer than the bound it passed, unless the library
       * changed meanwhile: read everything again. */
      self->count_exact = FALSE;
      lamina_construction_list_refresh (self);
    }
}

const char *
lamina_construction_list_get_error (LaminaConstructionList *self)
{
  g_return_val_if_fail (LAMINA_IS_CONSTRUCTION_LIST (self), NULL);
  return self->error;
}
