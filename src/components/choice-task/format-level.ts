/** How a level reads to respondents: the one rule lives in shared/study/level-labels.ts. */
export { getLevelLabel as formatLevel } from '@shared/study/level-labels';
