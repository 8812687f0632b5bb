-- A counter that moves whenever what a signed-in request knows about its user may have changed: a session ended or
-- changed (sign-out, revocation, refresh), a user changed (role, ban, name), or a trade account or its membership
-- changed. Each process keeps recent sessions in memory and drops them all when it moves (server/middleware/session.ts).
INSERT INTO `change_versions` (`topic`, `version`) VALUES ('accounts', 0);
--> statement-breakpoint
CREATE TRIGGER `session_changed_update` AFTER UPDATE ON `session` BEGIN UPDATE `change_versions` SET `version` = `version` + 1 WHERE `topic` = 'accounts'; END;
--> statement-breakpoint
CREATE TRIGGER `session_changed_delete` AFTER DELETE ON `session` BEGIN UPDATE `change_versions` SET `version` = `version` + 1 WHERE `topic` = 'accounts'; END;
--> statement-breakpoint
CREATE TRIGGER `user_changed_update` AFTER UPDATE ON `user` BEGIN UPDATE `change_versions` SET `version` = `version` + 1 WHERE `topic` = 'accounts'; END;
--> statement-breakpoint
CREATE TRIGGER `user_changed_delete` AFTER DELETE ON `user` BEGIN UPDATE `change_versions` SET `version` = `version` + 1 WHERE `topic` = 'accounts'; END;
--> statement-breakpoint
CREATE TRIGGER `dealer_accounts_changed_insert` AFTER INSERT ON `dealer_accounts` BEGIN UPDATE `change_versions` SET `version` = `version` + 1 WHERE `topic` = 'accounts'; END;
--> statement-breakpoint
CREATE TRIGGER `dealer_accounts_changed_update` AFTER UPDATE ON `dealer_accounts` BEGIN UPDATE `change_versions` SET `version` = `version` + 1 WHERE `topic` = 'accounts'; END;
--> statement-breakpoint
CREATE TRIGGER `dealer_accounts_changed_delete` AFTER DELETE ON `dealer_accounts` BEGIN UPDATE `change_versions` SET `version` = `version` + 1 WHERE `topic` = 'accounts'; END;
--> statement-breakpoint
CREATE TRIGGER `dealer_members_changed_insert` AFTER INSERT ON `dealer_members` BEGIN UPDATE `change_versions` SET `version` = `version` + 1 WHERE `topic` = 'accounts'; END;
--> statement-breakpoint
CREATE TRIGGER `dealer_members_changed_update` AFTER UPDATE ON `dealer_members` BEGIN UPDATE `change_versions` SET `version` = `version` + 1 WHERE `topic` = 'accounts'; END;
--> statement-breakpoint
CREATE TRIGGER `dealer_members_changed_delete` AFTER DELETE ON `dealer_members` BEGIN UPDATE `change_versions` SET `version` = `version` + 1 WHERE `topic` = 'accounts'; END;
