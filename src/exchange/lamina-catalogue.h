/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-catalogue.h: the catalogue XML document (urn:x-lamina:catalogue:1),
 * read and written.  Untrusted input: no network, no DTD, no entities; a
 * document is validated against data/lamina-catalogue-1.xsd and every rule
 * of the model, and nothing is returned unless all of it is good. */
#pragma once

#include <glib-object.h>

#include "lamina-calc.h"
#include "lamina-climate.h"
#include "lamina-construction.h"
#include "lamina-job.h"
#include "lamina-target-set.h"

G_BEGIN_DECLS

#define LAMINA_CATALOGUE_NAMESPACE "urn:x-lamina:catalogue:1"
#define LAMINA_CATALOGUE_FORMAT    1

#define LAMINA_XML_ERROR (lamina_xml_error_quark ())
typedef enum
{
  LAMINA_XML_ERROR_IO,        /* cannot read or write the file */
  LAMINA_XML_ERROR_MALFORMED, /* not well-formed, DOCTYPE, wrong root */
  LAMINA_XML_ERROR_SCHEMA,    /* breaks the XSD */
  LAMINA_XML_ERROR_INVALID,   /* a value breaks a rule of the model */
} LaminaXmlError;
GQuark lamina_xml_error_quark (void);

typedef struct
{
  char      *title;          /* optional: the practice or library name */
  GPtrArray *materials;      /* LaminaMaterial*, owned */
  GPtrArray *climates;       /* LaminaClimate*, owned (EN ISO 13788) */
  GPtrArray *constructions;  /* LaminaConstruction*, owned; layers carry
                                copies of the materials they use */
  GPtrArray *target_sets;    /* LaminaTargetSet*, owned */
  GPtrArray *jobs;           /* LaminaJob*, owned; entries name constructions
                                of the document or of the library */
} LaminaCatalogue;

typedef enum
{
  LAMINA_WRITE_DEFAULT = 0,
  LAMINA_WRITE_DERIVED = 1 << 0, /* add each construction's computed figures */
} LaminaWriteFlags;

LaminaCatalogue *lamina_catalogue_new          (void);
void             lamina_catalogue_free         (LaminaCatalogue       *catalogue);
LaminaConstruction *lamina_catalogue_find      (const LaminaCatalogue *catalogue,
                                                const char            *id);
/* A library material of the catalogue (not a layer's snapshot), or NULL. */
LaminaMaterial  *lamina_catalogue_find_material (const LaminaCatalogue *catalogue,
                                                 const char            *id);
LaminaTargetSet *lamina_catalogue_find_target_set (const LaminaCatalogue *catalogue,
                                                   const char            *id);
LaminaJob       *lamina_catalogue_find_job      (const LaminaCatalogue *catalogue,
                                                 const char            *id);

LaminaClimate   *lamina_catalogue_find_climate (const LaminaCatalogue *catalogue,
                                                const char            *id);
/* What a construction's <moisture> needs from the document: its climate
 * among @catalogue's, and a vapour resistance factor on every material
 * unless the layer declares sd.  @line receives the offending item's
 * source line (0 if none).  Messages name the material. */
gboolean         lamina_catalogue_check_moisture (const LaminaCatalogue    *catalogue,
                                                  const LaminaConstruction *construction,
                                                  int                      *line,
                                                  GError                  **error);
/* Errors read "NAME:LINE: message", NAME being @name (a file path). */
LaminaCatalogue *lamina_catalogue_read_memory  (const char            *data,
                                                gsize                  length,
                                                const char            *name,
                                                GError               **error);
LaminaCatalogue *lamina_catalogue_read_file    (const char            *path,
                                                GError               **error);

char            *lamina_catalogue_write_to_string (const LaminaCatalogue *catalogue,
                                                   LaminaWriteFlags       flags,
                                                   gsize                 *length,
                                                   GError               **error);
/* Atomic: writes a temporary file beside @path, then renames it. */
gboolean         lamina_catalogue_write_file   (const LaminaCatalogue *catalogue,
                                                const char            *path,
                                                LaminaWriteFlags       flags,
                                                GError               **error);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaCatalogue, lamina_catalogue_free)

G_END_DECLS
