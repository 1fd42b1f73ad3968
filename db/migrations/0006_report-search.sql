ALTER TABLE "report_revisions" ADD COLUMN "search_vector" "tsvector" GENERATED ALWAYS AS (setweight(to_tsvector('english'::regconfig, coalesce(content->>'title', '')), 'A')
          || setweight(to_tsvector('english'::regconfig, jsonb_path_query_array(content, '$.tools[*].name')), 'B')
          || setweight(to_tsvector('english'::regconfig, regexp_replace(regexp_replace(regexp_replace(regexp_replace(body_mdx,
    '<[A-Za-z/][^>]*>', ' ', 'g'),
    '\[([^]]*)\]\([^)]*\)', '\1', 'g'),
    '[#*_`>~|\uE000\uE001]+', ' ', 'g'),
    '\s+', ' ', 'g')), 'C')) STORED NOT NULL;--> statement-breakpoint
CREATE INDEX "report_revisions_search_idx" ON "report_revisions" USING gin ("search_vector");