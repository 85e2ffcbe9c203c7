/**
 * The `datapackage.json` of a saved comparison: a Frictionless Data Package (spec v1,
 * https://specs.frictionlessdata.io/data-package/) of profile `tabular-data-package`, with one
 * tabular data resource per CSV table (Table Schema fields with name, type and description, the
 * unit in the custom `unit` property and in the description), the frozen results as a JSON
 * resource, and the comparison's own facts under the custom `evenload` property. Pure.
 */
import { dataTablesOf, type PackageLayout, type TableDefinition } from './data-tables';

export const DATA_PACKAGE_PATH = 'datapackage.json';
export const RESULTS_PATH = 'results.json';
export const MANIFEST_PATH = 'MANIFEST-SHA256.txt';

export interface SavedComparisonFacts {
  slug: string;
  title: string;
  author: string;
  createdAt: string;
  link: string;
  citation: string;
  query: Record<string, unknown>;
  runCount: number;
  softwareVersion: string;
  dataSha256: string;
  layout: PackageLayout;
}

function tableResource(table: TableDefinition, sha256: string) {
  return {
    name: table.name,
    path: table.path,
    profile: 'tabular-data-resource',
    title: table.title,
    description: table.description,
    format: 'csv',
    mediatype: 'text/csv',
    encoding: 'utf-8',
    hash: `sha256:${sha256}`,
    dialect: { delimiter: ',', lineTerminator: '\r\n', quoteChar: '"', doubleQuote: true, header: true },
    schema: {
      fields: table.fields.map((f) => ({ name: f.name, type: f.type, description: f.unit ? `${f.description} Unit: ${f.unit}.` : f.description, ...(f.unit ? { unit: f.unit } : {}) })),
      primaryKey: [...table.primaryKey],
      missingValues: [''],
    },
  };
}

/** The descriptor; `fileSha256` gives the sha256 of each data file and of results.json by path. */
export function dataPackageDescriptor(facts: SavedComparisonFacts, fileSha256: Record<string, string>) {
  const tables = dataTablesOf(facts.layout);
  return {
    profile: 'tabular-data-package',
    name: `evenload-comparison-${facts.slug.toLowerCase()}`,
    id: facts.link,
    title: facts.title,
    description: `A frozen comparison of ${facts.runCount} runs with the data it used. ${facts.citation}`,
    created: facts.createdAt,
    homepage: facts.link,
    contributors: [{ title: facts.author, role: 'author' }],
    resources: [
      ...tables.map((t) => tableResource(t, fileSha256[t.path] ?? '')),
      {
        name: 'frozen_results',
        path: RESULTS_PATH,
        profile: 'data-resource',
        title: 'Results as frozen',
        description: 'The comparison’s results exactly as shown when it was frozen, and its headline numbers.',
        format: 'json',
        mediatype: 'application/json',
        encoding: 'utf-8',
        hash: `sha256:${fileSha256[RESULTS_PATH] ?? ''}`,
      },
    ],
    evenload: {
      query: facts.query,
      runCount: facts.runCount,
      softwareVersion: facts.softwareVersion,
      dataSha256: facts.dataSha256,
      dataSha256Method: `sha256 of the lines "<sha256>  <path>\\n" of ${tables.map((t) => t.path).join(', ')}, in that order`,
      packageLayout: facts.layout,
    },
  };
}
