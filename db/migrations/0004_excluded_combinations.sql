-- Words of our own: a study definition's "prohibitions" (pairs of levels never shown
-- together) become "excludedCombinations", a list of rules of several kinds; each stored pair
-- becomes a rule of kind "pair" with the same id and levels. Frozen study versions are
-- converted too, so every stored definition reads with the same schema.
UPDATE "studies"
SET "definition" = ("definition" - 'prohibitions') || jsonb_build_object(
  'excludedCombinations',
  COALESCE(
    (SELECT jsonb_agg(p || '{"kind":"pair"}'::jsonb ORDER BY n)
       FROM jsonb_array_elements("definition" -> 'prohibitions') WITH ORDINALITY AS x(p, n)),
    '[]'::jsonb
  )
)
WHERE "definition" ? 'prohibitions' AND jsonb_typeof("definition" -> 'prohibitions') = 'array';
--> statement-breakpoint
UPDATE "studies" SET "definition" = "definition" - 'prohibitions' WHERE "definition" ? 'prohibitions';
--> statement-breakpoint
UPDATE "study_versions"
SET "definition" = ("definition" - 'prohibitions') || jsonb_build_object(
  'excludedCombinations',
  COALESCE(
    (SELECT jsonb_agg(p || '{"kind":"pair"}'::jsonb ORDER BY n)
       FROM jsonb_array_elements("definition" -> 'prohibitions') WITH ORDINALITY AS x(p, n)),
    '[]'::jsonb
  )
)
WHERE "definition" ? 'prohibitions' AND jsonb_typeof("definition" -> 'prohibitions') = 'array';
--> statement-breakpoint
UPDATE "study_versions" SET "definition" = "definition" - 'prohibitions' WHERE "definition" ? 'prohibitions';
