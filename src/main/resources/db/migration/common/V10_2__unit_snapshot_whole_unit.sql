-- The frozen record of a unit keeps the whole evaluation (result, chart points, conditions, operators and
-- the calibration records used per instrument), so the lot's pages, API and certificates after
-- disposition are drawn from it and never recomputed. Rows frozen earlier keep null here.
alter table unit_evaluation_snapshot add column unit_json varchar;
