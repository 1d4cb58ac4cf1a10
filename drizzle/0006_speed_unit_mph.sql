-- A campaign's display speed unit `m/h` always meant mile per hour; it is now spelled `mph`,
-- and `m/h` means metre per hour. Frozen revisions keep their figures; only the label moves.
UPDATE `campaign` SET `definition` = json_set(`definition`, '$.speedUnit', 'mph') WHERE json_extract(`definition`, '$.speedUnit') = 'm/h';--> statement-breakpoint
UPDATE `campaign_revision` SET `snapshot` = json_set(`snapshot`, '$.definition.speedUnit', 'mph') WHERE json_extract(`snapshot`, '$.definition.speedUnit') = 'm/h';
