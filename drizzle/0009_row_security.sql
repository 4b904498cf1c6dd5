-- Row-level security: a second layer under the application's own membership checks. Each pooled
-- connection carries the scope of the work it runs (server/db/scope.ts sets it on every checkout):
--   equipot.user       the signed-in person's id, or empty
--   equipot.campaigns  'none', 'all' (named system work only) or a comma-separated list of campaign ids
-- A row of campaign data is visible and writable when the scope is 'all', or when its campaign is in
-- the scope and the person is a member of it. FORCE applies the policies to the tables' owner too;
-- only a superuser or a BYPASSRLS role passes them, and the server refuses to run as either.
CREATE FUNCTION equipot_user() RETURNS uuid LANGUAGE sql STABLE AS $$
  SELECT nullif(current_setting('equipot.user', true), '')::uuid
$$;
--> statement-breakpoint
CREATE FUNCTION equipot_scope_is(kind text) RETURNS boolean LANGUAGE sql STABLE AS $$
  SELECT coalesce(current_setting('equipot.campaigns', true), '') = kind
$$;
--> statement-breakpoint
CREATE FUNCTION equipot_scope_ids() RETURNS uuid[] LANGUAGE sql STABLE AS $$
  SELECT CASE
    WHEN coalesce(current_setting('equipot.campaigns', true), '') ~* '^[0-9a-f-]{36}(,[0-9a-f-]{36})*$'
    THEN string_to_array(current_setting('equipot.campaigns', true), ',')::uuid[]
    ELSE '{}'::uuid[]
  END
$$;
--> statement-breakpoint
-- The person's campaigns, for the memberships table's own policies (a sub-select of memberships
-- there would recurse). Its SET shows it every membership row; plpgsql keeps its plan.
CREATE FUNCTION equipot_member_campaigns() RETURNS uuid[] LANGUAGE plpgsql STABLE
SET equipot.campaigns = 'all' AS $$
BEGIN
  RETURN (SELECT coalesce(array_agg(campaign_id), '{}') FROM memberships WHERE user_id = equipot_user());
END $$;
--> statement-breakpoint
DO $$
DECLARE
  -- @col is the table's campaign column. The scalar sub-selects run once per statement (init
  -- plans), not once per row; an OR's later arms run only when the earlier ones are false.
  system constant text := '(SELECT equipot_scope_is(''all''))';
  listed constant text := '@col = ANY ((SELECT equipot_scope_ids())::uuid[])';
  member constant text := '@col IN (SELECT m.campaign_id FROM memberships m WHERE m.user_id = (SELECT equipot_user()))';
  allows constant text := system || ' OR (' || listed || ' AND ' || member || ')';
  by_campaign constant text := replace(allows, '@col', 'campaign_id');
  -- Memberships: one's own rows first, so the sub-select above never needs the function.
  member_self constant text := system || ' OR (' || replace(listed, '@col', 'campaign_id')
    || ' AND campaign_id = ANY ((SELECT equipot_member_campaigns())::uuid[]))';
  t text;
BEGIN
  FOREACH t IN ARRAY ARRAY[
    'invites', 'sites', 'conflicts', 'attachments', 'attachment_links',
    'checklist_templates', 'checklist_runs', 'checklist_results', 'crates', 'benchmarks',
    'field_entries', 'levelling_sections', 'levelling_setups', 'legs', 'handovers', 'alerts',
    'instruments', 'height_ties', 'levelling_adjustments', 'comparison_runs', 'comparison_files',
    'comparison_analyses', 'entry_reviews', 'review_summary_subscriptions'
  ] LOOP
    EXECUTE format('CREATE POLICY campaign_scope ON %I USING (%s) WITH CHECK (%s)', t, by_campaign, by_campaign);
  END LOOP;
  -- One's own memberships and campaigns are readable outside any campaign (sign-in, the list).
  EXECUTE format('CREATE POLICY campaign_scope_read ON memberships FOR SELECT USING (user_id = (SELECT equipot_user()) OR %s)', member_self);
  EXECUTE format('CREATE POLICY campaign_scope_add ON memberships FOR INSERT WITH CHECK (%s)', member_self);
  EXECUTE format('CREATE POLICY campaign_scope_change ON memberships FOR UPDATE USING (%s) WITH CHECK (%s)', member_self, member_self);
  EXECUTE format('CREATE POLICY campaign_scope_remove ON memberships FOR DELETE USING (%s)', member_self);
  EXECUTE format('CREATE POLICY campaign_scope ON campaigns USING (%s) WITH CHECK (%s)', replace(allows, '@col', 'id'), replace(allows, '@col', 'id'));
  EXECUTE format('CREATE POLICY own_campaigns ON campaigns FOR SELECT USING (%s)', replace(member, '@col', 'id'));
  -- Sign-in and system events have no campaign.
  EXECUTE format('CREATE POLICY campaign_scope ON audit_events USING (campaign_id IS NULL OR %s) WITH CHECK (campaign_id IS NULL OR %s)', by_campaign, by_campaign);
  -- A device's refused mutations belong to the person who sent them (a member removed since
  -- still gets their own back for recovery).
  EXECUTE format('CREATE POLICY own_refusals ON sync_rejections USING (%s OR user_id = (SELECT equipot_user())) WITH CHECK (%s OR user_id = (SELECT equipot_user()))', system, system);
  -- The samples belong to a file; the file's policy decides.
  EXECUTE 'CREATE POLICY campaign_scope ON comparison_chunks USING (EXISTS (SELECT 1 FROM comparison_files f WHERE f.id = file_id)) WITH CHECK (EXISTS (SELECT 1 FROM comparison_files f WHERE f.id = file_id))';
  FOREACH t IN ARRAY ARRAY[
    'campaigns', 'memberships', 'audit_events', 'comparison_chunks', 'sync_rejections',
    'invites', 'sites', 'conflicts', 'attachments', 'attachment_links', 'checklist_templates',
    'checklist_runs', 'checklist_results', 'crates', 'benchmarks', 'field_entries',
    'levelling_sections', 'levelling_setups', 'legs', 'handovers', 'alerts', 'instruments',
    'height_ties', 'levelling_adjustments', 'comparison_runs', 'comparison_files',
    'comparison_analyses', 'entry_reviews', 'review_summary_subscriptions'
  ] LOOP
    EXECUTE format('ALTER TABLE %I ENABLE ROW LEVEL SECURITY', t);
    EXECUTE format('ALTER TABLE %I FORCE ROW LEVEL SECURITY', t);
  END LOOP;
END $$;
--> statement-breakpoint
-- Client-made ids are unique across campaigns: this tells which ids exist, and nothing else about
-- the rows. Its own SET lifts the scope for its one query only.
CREATE FUNCTION equipot_taken_ids(tbl regclass, ids uuid[]) RETURNS SETOF uuid LANGUAGE plpgsql STABLE
SET equipot.campaigns = 'all' AS $$
BEGIN
  RETURN QUERY EXECUTE format('SELECT id FROM %s WHERE id = ANY ($1)', tbl) USING ids;
END $$;
