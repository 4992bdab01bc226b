/* SPDX-License-Identifier: GPL-3.0-or-later */
/* A per-thread scratch arena for the engine: a calculation takes all its
 * working memory from it and gives it back at once, so that a drag step or
 * a bulk recalculation does not spend its time in malloc.  The first chunk
 * is kept between calculations and grows to the largest need seen. */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-calc-private.h"

#include <string.h>

#define FIRST_CHUNK (16 * 1024)
#define ALIGN 16

struct _LaminaScratch
{
  guint8 *base;
  gsize   size;
  gsize   used;
  GSList *overflow;   /* chunks taken when base ran out; freed on reset */
  gsize   overflow_bytes;
  guint   depth;
};

static void
scratch_free (gpointer data)
{
  LaminaScratch *s = data;

  g_slist_free_full (s->overflow, g_free);
  g_free (s->base);
  g_free (s);
}

static GPrivate scratch_key = G_PRIVATE_INIT (scratch_free);

LaminaScratch *
lamina_scratch_begin (void)
{
  LaminaScratch *s = g_private_get (&scratch_key);

  if (s == NULL)
    {
      s = g_new0 (LaminaScratch, 1);
      s->size = FIRST_CHUNK;
      s->base = g_malloc (s->size);
      g_private_set (&scratch_key, s);
    }
  g_assert (s->depth == 0);   /* the engine does not nest calculations */
  s->depth++;
  s->used = 0;
  return s;
}

void
lamina_scratch_end (LaminaScratch *s)
{
  g_assert (s->depth == 1);
  s->depth--;
  if (s->overflow != NULL)
    {
      gsize need = s->used + s->overflow_bytes;

      g_slist_free_full (g_steal_pointer (&s->overflow), g_free);
      s->overflow_bytes = 0;
      g_free (s->base);
      s->size = MAX (s->size * 2, need + FIRST_CHUNK);
      s->base = g_malloc (s->size);
    }
  s->used = 0;
}

gpointer
lamina_scratch_alloc (LaminaScratch *s,
                      gsize          bytes)
{
  gpointer p;

  bytes = (bytes + ALIGN - 1) & ~(gsize) (ALIGN - 1);
  if (s->used + bytes <= s->size)
    {
      p = s->base + s->used;
      s->used += bytes;
    }
  else
    {
      p = g_malloc (bytes);
      s->overflow = g_slist_prepend (s->overflow, p);
      s->overflow_bytes += bytes;
    }
  return memset (p, 0, bytes);
}
