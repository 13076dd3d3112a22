/**
 * The journeys that read or change the seeded demo study (its runs, erasures, design
 * versions) take this lock, so two of them never run at once: an erasure is refused while a
 * run of the study is being estimated, marks the runs that used the respondent, and a redesign
 * makes the study live again on a new version. Every other journey makes its own study.
 */
export const demoStudyLock = { lock: 'seeded-demo-study' };
