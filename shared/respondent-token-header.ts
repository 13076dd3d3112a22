/**
 * The header that carries a respondent's secret session token. Kept apart from the zod
 * schemas so the respondent bundle can use it without loading zod.
 */
export const RESPONDENT_TOKEN_HEADER = 'x-respondent-token';
