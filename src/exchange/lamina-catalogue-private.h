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

G_END_DECLS
