-- Reference data the registry ships with. Instruments store totals only: never items, instructions or response wording.
-- Sources are named beside each value; "unverified" marks a value recalled but not checked against the source.

-- ICD-10 M72.2 "plantar fascial fibromatosis" is where ICD-10 (WHO, ICD-10-AM) classifies plantar fasciitis
-- (Australian DVA Statement of Principles summary). The inclusion wording is unverified. ICD-10-CM also uses M72.2
-- (billable, no laterality digit): unverified against the current CMS/NCHS tabular.
INSERT INTO "condition" ("code", "label", "icd10") VALUES
  ('plantar-heel-pain', 'Plantar heel pain', 'M72.2');
--> statement-breakpoint

-- NPRS MCID: about 2 points or 30% (Farrar 2001, chronic-pain trials, anchored on "much improved");
-- "much better" 2 points or 33% (Salaffi 2004, chronic musculoskeletal pain). Not established for heel pain specifically.
-- FAAM ADL MCID 8 points, MDC 5.7 (Martin 2005). LEFS MCID 9 points, MDC 9 (Binkley 1999).
-- PSFS: the often-quoted 2 points is Stratford 1995's MDC (90% CI) for the mean score, not an MCID; we use the
-- medium change of Abbott & Schmitt 2014 (2.3), which also clears that MDC so measurement noise is not counted.
-- GROC (-7..+7, 15-point variant; range as in Jaeschke 1989, unverified) is the anchor MCIDs are set against:
-- it has no MCID of its own. "Improved" is usually >= +3 (common practice, no source).
INSERT INTO "instrument" ("code", "label", "unit", "min", "max", "higher_is_better", "mcid", "mcid_source", "body_region") VALUES
  ('nprs-first-step', 'Pain on first steps in the morning (0–10)', 'points', 0, 10, false, 2,
   'Farrar 2001 (about 2 points or 30%, chronic-pain trials); Salaffi 2004 (2 points or 33%, "much better", chronic musculoskeletal pain). Not established for heel pain.', 'foot'),
  ('nprs-usual', 'Usual pain (0–10)', 'points', 0, 10, false, 2,
   'Farrar 2001 (about 2 points or 30%, chronic-pain trials); Salaffi 2004 (2 points or 33%, "much better", chronic musculoskeletal pain). Not established for heel pain.', 'foot'),
  ('faam-adl', 'Foot and ankle function, daily living (0–100)', 'percent', 0, 100, true, 8,
   'Martin 2005 (ADL subscale: MCID 8 points, MDC 5.7)', 'foot-ankle'),
  ('lefs', 'Lower-extremity function (0–80)', 'points', 0, 80, true, 9,
   'Binkley 1999 (MCID 9 points; MDC 9 points, 90% CI)', 'lower-limb'),
  ('psfs', 'Patient-specific function, mean rating (0–10)', 'points', 0, 10, true, 2.3,
   'Abbott & Schmitt 2014 (medium change 2.3 on the 0–10 mean; small 1.3, large 2.7). Stratford 1995 gives 2 points as the MDC (90% CI), not an MCID.', 'patient-chosen'),
  ('groc', 'Global rating of change (−7 to +7)', 'points', -7, 7, true, NULL,
   'No MCID of its own: the global rating of change is the anchor other instruments'' MCIDs are set against (common practice, no source).', 'whole-person');
--> statement-breakpoint

-- Intervention codes: our own short codes and plain labels (an internal list rather than a licensed code system).
INSERT INTO "intervention_code" ("code", "label", "kind", "graded") VALUES
  ('education-load', 'Education and load management', 'core', false),
  ('fascia-stretch', 'Plantar fascia stretch', 'core', false),
  ('heel-raises', 'Graded heel raises', 'core', true),
  ('toe-flexor', 'Toe flexor strengthening', 'addon', false),
  ('toe-isolation', 'Toe isolation drills', 'addon', false),
  ('split-squats', 'Graded split squats', 'addon', true),
  ('single-leg-balance', 'Graded single-leg balance', 'addon', true),
  ('dynamic-warm-up', 'Dynamic warm-up', 'addon', false),
  ('heel-cup', 'Heel cup or prefabricated orthosis', 'addon', false),
  ('footwear-change', 'Footwear change', 'addon', false),
  ('taping', 'Taping', 'addon', false),
  ('night-splint', 'Night splint', 'addon', false);
--> statement-breakpoint

-- Version 1 of the registry rules: the defaults of shared/rules.ts (a test checks they still match).
INSERT INTO "registry_rules" ("rules", "reason") VALUES (
  '{"recovery":{"instrumentCode":"nprs-first-step","threshold":2},"primaryWindow":{"fromWeek":10,"toWeek":16,"targetWeek":12},"followUpWindows":{"week6":{"fromDay":35,"toDay":56},"week12":{"fromDay":70,"toDay":112},"week26":{"fromDay":168,"toDay":210}},"targets":{"recoveredByWeek12":0.5,"respondersAtWeek12":0.6},"minCellEstimate":10,"minCellResearcher":5,"exportK":5,"completenessTarget":0.8}'::jsonb,
  'Shipped defaults (registry settings, not published norms)'
);
