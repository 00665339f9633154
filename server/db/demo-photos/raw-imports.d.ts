// Nitro's `raw:` imports of binary files give their bytes (plugin 03.photos bundles the demo photos).
declare module 'raw:*.jpg' {
  const bytes: Uint8Array
  export default bytes
}
declare module 'raw:*.webp' {
  const bytes: Uint8Array
  export default bytes
}
