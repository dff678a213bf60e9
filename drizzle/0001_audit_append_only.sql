-- The audit trail is append-only: nobody, not even an admin through the app, edits or deletes it.
CREATE TRIGGER audit_event_no_update BEFORE UPDATE ON audit_event
BEGIN
  SELECT RAISE(ABORT, 'audit_event is append-only');
END;
--> statement-breakpoint
CREATE TRIGGER audit_event_no_delete BEFORE DELETE ON audit_event
BEGIN
  SELECT RAISE(ABORT, 'audit_event is append-only');
END;
--> statement-breakpoint
-- Decisions are history too.
CREATE TRIGGER decision_no_update BEFORE UPDATE ON decision
BEGIN
  SELECT RAISE(ABORT, 'decision is append-only');
END;
