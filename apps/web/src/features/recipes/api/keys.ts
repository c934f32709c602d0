/** Query-key roots of recipe data; mutations invalidate through these. */
export const recipesRoot = (shopId: string) => ["shops", shopId, "recipes"] as const;
export const recipeRoot = (shopId: string, recipeId: string) => ["shops", shopId, "recipes", "one", recipeId] as const;
