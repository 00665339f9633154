// What the builder's pieces share without passing it down each level: the studio's recipes, their
// ingredients (fetched once each, when a picker or a chip needs them) and a chip's words.
import type { InjectionKey, Ref } from 'vue'
import type { LiveField } from '~~/shared/utils/show-segments'

export interface BuilderRecipe { id: number; title: string }
export interface BuilderIngredient { key: string; item: string }

export interface BuilderContext {
  recipes: Ref<BuilderRecipe[]>
  ingredients: (recipeId: number) => BuilderIngredient[] | null
  fieldLabel: (field: LiveField) => string
}

export const builderKey: InjectionKey<BuilderContext> = Symbol('episode-builder')

export function provideBuilder(recipes: Ref<BuilderRecipe[]>): BuilderContext {
  const loaded = reactive(new Map<number, BuilderIngredient[] | null>())
  function ingredients(recipeId: number) {
    if (!loaded.has(recipeId)) {
      loaded.set(recipeId, null)
      $fetch<{ ingredients: BuilderIngredient[] }>(`/api/recipes/${recipeId}`)
        .then((r) => loaded.set(recipeId, r.ingredients.map((i) => ({ key: i.key, item: i.item }))))
        .catch(() => loaded.set(recipeId, []))
    }
    return loaded.get(recipeId) ?? null
  }
  const fieldLabel = (field: LiveField) => liveFieldLabel(field, {
    recipe: (id) => recipes.value.find((r) => r.id === id)?.title,
    ingredient: (id, key) => ingredients(id)?.find((i) => i.key === key)?.item,
  })
  const ctx = { recipes, ingredients, fieldLabel }
  provide(builderKey, ctx)
  return ctx
}

export function useBuilder(): BuilderContext {
  const ctx = inject(builderKey)
  if (!ctx) throw new Error('useBuilder outside the episode builder')
  return ctx
}
