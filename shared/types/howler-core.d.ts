// howler's core build (no spatial plugin) has the same API as the package's main file.
declare module 'howler/dist/howler.core.min.js' {
  export * from 'howler'
}
