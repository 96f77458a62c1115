ALTER TABLE `load_cases` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
-- A released or superseded revision is never deleted, by a route or by a cascade (a mission's,
-- a workspace's): the database refuses it whatever the code above it does.
CREATE TRIGGER `load_cases_keep_released` BEFORE DELETE ON `load_cases`
WHEN OLD.`status` IN ('released', 'superseded')
BEGIN
  SELECT RAISE(ABORT, 'released load cases are never deleted');
END;
