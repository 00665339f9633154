// What the command-line scripts share with the server: the database path from the same variable.
export const databasePath = process.env.NUXT_DATABASE_PATH || '.data/hobline.sqlite'
