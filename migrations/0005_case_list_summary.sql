ALTER TABLE `load_cases` ADD `orbit_average_absorbed_w` real;--> statement-breakpoint
ALTER TABLE `load_cases` ADD `beta_deg` real;--> statement-breakpoint
UPDATE `load_cases` SET `orbit_average_absorbed_w` = json_extract(`results`, '$.total.orbitAverageAbsorbedW'), `beta_deg` = json_extract(`results`, '$.betaDeg');