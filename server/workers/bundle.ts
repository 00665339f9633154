// Bundles a worker entry (with the domain core it imports) into one CommonJS script at build time,
// served to the server as the text of a virtual module so that `new Worker(code, { eval: true })`
// needs no file beside the build output. Used by nuxt.config.ts.
import { build } from 'esbuild'

export async function bundleWorker(entry: string): Promise<string> {
  const result = await build({
    entryPoints: [entry], bundle: true, platform: 'node', format: 'cjs', target: 'node20', write: false, minify: true, logLevel: 'silent',
  })
  return `export default ${JSON.stringify(result.outputFiles[0]!.text)}`
}
