/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-catalogue-private.h: what the reader and the writer of the
 * catalogue XML share inside the exchange module. */
#pragma once

#include <libxml/tree.h>

#include "lamina-catalogue.h"

G_BEGIN_DECLS

/* Documents larger than this are refused before parsing. */
#define LAMINA_CATALOGUE_MAX_SIZE ((gsize) 256 * 1024 * 1024)

G_DEFINE_AUTOPTR_CLEANUP_FUNC (xmlDoc, xmlFreeDoc)

/* Parses untrusted XML safely (no network, no DTD, no entities: a document
 * with a DOCTYPE is refused) and checks the root element, the format
 * version and the schema.  Errors read "NAME:LINE: message". */
xmlDoc *lamina_xml_document_parse (const char  *data,
                                   gsize        length,
                                   const char  *name,
                                   GError     **error);

/* Checks a document Lamina wrote against the schema without building a
 * tree (the writer's last guard). */
gboolean lamina_xml_document_check (const char  *data,
                                    gsize        length,
                                    const char  *name,
                                    GError     **error);

/* The source line of an element (or of an attribute's element) of a
 * document from lamina_xml_document_parse. */
int     lamina_xml_node_get_line  (xmlNode     *node);

/* Reading values (lamina-xml-document.c): an attribute or the text of an
 * element as an owned string (NULL if the attribute is absent); whether
 * @node is the catalogue's element @name; a whole attribute as one finite
 * number in the C locale, or FALSE with a message for the user. */
char    *lamina_xml_dup_attr      (xmlNode     *node,
                                   const char  *name);
char    *lamina_xml_dup_text      (xmlNode     *node);
gboolean lamina_xml_is_element    (xmlNode     *node,
                                   const char  *name);
gboolean lamina_xml_parse_number  (const char  *attr,
                                   const char  *text,
                                   double      *value,
                                   char       **message);

/* One document being read, for messages that locate a fault: each reads
 * "NAME:LINE: message" and goes to @error. */
typedef struct
{
  const char  *name;
  GError     **error;
} LaminaXmlSource;

/* Sets @s's error (@code of LAMINA_XML_ERROR) at @line; returns FALSE. */
gboolean lamina_xml_fail          (const LaminaXmlSource *s,
                                   int                    line,
                                   int                    code,
                                   const char            *format,
                                   ...) G_GNUC_PRINTF (4, 5);
/* Attribute @attr of @node as one finite number in the C locale (strict:
 * the whole attribute), or as a whole number from @min to @max; an
 * absent attribute leaves *@value alone.  FALSE with @s's error set,
 * located at @node. */
gboolean lamina_xml_get_number    (const LaminaXmlSource *s,
                                   xmlNode               *node,
                                   const char            *attr,
                                   double                *value);
gboolean lamina_xml_get_count     (const LaminaXmlSource *s,
                                   xmlNode               *node,
                                   const char            *attr,
                                   guint64                min,
                                   guint64                max,
                                   int                   *value);

/* Writing (lamina-catalogue-writer.c), for the parts of the vocabulary
 * kept in their own files: an escaped attribute (nothing if NULL), a
 * number that reads back exactly (nothing if NAN), a text element, and
 * the check that @text can be carried by XML at all. */
void     lamina_xml_write_attr    (GString     *out,
                                   const char  *name,
                                   const char  *value);
void     lamina_xml_write_number  (GString     *out,
                                   const char  *name,
                                   double       value);
void     lamina_xml_write_text_element (GString    *out,
                                        const char *indent,
                                        const char *name,
                                        const char *text);
gboolean lamina_xml_check_text    (const char  *where,
                                   const char  *field,
                                   const char  *text,
                                   GError     **error);

/* Target sets and jobs (lamina-catalogue-jobs.c).  The reader calls
 * these for each <target-set> and <job> element after the materials; the
 * writer puts target sets before the constructions and jobs after them.
 * Errors read "NAME:LINE: message". */
gboolean lamina_catalogue_read_target_set (LaminaCatalogue        *catalogue,
                                           xmlNode                *node,
                                           const LaminaXmlSource  *source);
gboolean lamina_catalogue_read_job        (LaminaCatalogue        *catalogue,
                                           xmlNode                *node,
                                           const LaminaXmlSource  *source);
gboolean lamina_catalogue_write_target_sets (const LaminaCatalogue *catalogue,
                                             GString               *out,
                                             GError               **error);
gboolean lamina_catalogue_write_jobs      (const LaminaCatalogue *catalogue,
                                           GString               *out,
                                           GError               **error);

G_END_DECLS
