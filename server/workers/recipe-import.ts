// The recipe import reader, run in a worker thread (server/utils/import-reader.ts) so that reading a
// large or hostile page never holds the event loop every live shoot shares. Bundled on its own at
// build time (server/workers/bundle.ts); it imports only the domain core.
import { parentPort } from 'node:worker_threads'
import { importSchemaOrgRecipe } from '../../shared/utils/schemaorg-import'
import { RecipeImportError } from '../../shared/utils/schemaorg-read'
import type { QuantityParseOptions } from '../../shared/utils/quantity'
import { recipeCreateSchema } from '../../shared/utils/recipe-schemas'
import { checkInput } from '../../shared/utils/input-words'

export interface ImportTask { id: number; text: string; options: QuantityParseOptions }

/** The import, and the recipe it gives checked as a new recipe would be (the first problem, if any). */
function readImport(text: string, options: QuantityParseOptions) {
  const imported = importSchemaOrgRecipe(text, options)
  const checked = checkInput(recipeCreateSchema, imported.recipe)
  if (checked.ok) return { imported, body: checked.data }
  return { imported, invalid: { field: checked.field, message: checked.message } }
}
export type ImportRead = ReturnType<typeof readImport>

parentPort?.on('message', ({ id, text, options }: ImportTask) => {
  try {
    parentPort!.postMessage({ id, result: readImport(text, options) })
  } catch (error) {
    if (error instanceof RecipeImportError) parentPort!.postMessage({ id, refused: error.message })
    else parentPort!.postMessage({ id, failed: error instanceof Error ? error.message : String(error) })
  }
})
