import { Button, Tag } from '@carbon/react';
import type { AdviceRuleView } from '@stormhour/shared';
import { useState } from 'react';
import { LoadError } from '../../../components/LoadError';
import { PageSection } from '../../../components/PageSection';
import { SortableTable } from '../../../components/SortableTable';
import { TableSearch } from '../../../components/TableSearch';
import { useSessionUser } from '../../../lib/auth';
import { useAdviceRules } from '../api';
import { describeCondition } from '../ruleForm';
import { RuleEditor } from './RuleEditor';

const HEADERS = [
  { key: 'priority', header: 'Priority' },
  { key: 'crop', header: 'Crop' },
  { key: 'stage', header: 'Stage' },
  { key: 'condition', header: 'When' },
  { key: 'text', header: 'Advice' },
  { key: 'source', header: 'Source' },
  { key: 'state', header: 'State' },
];

const clip = (text: string, n: number) => (text.length > n ? `${text.slice(0, n - 1)}…` : text);

/** The advice rules: a sortable, searchable list, and one rule's form with a live preview. */
export default function AdviceRulesPage() {
  const user = useSessionUser();
  const canEdit = user.role === 'scientist';
  const rules = useAdviceRules();
  const [editing, setEditing] = useState<AdviceRuleView | 'new' | null>(null);
  const [query, setQuery] = useState('');
  const [notice, setNotice] = useState<string | null>(null);

  const needle = query.trim().toLowerCase();
  const rows = (rules.data ?? [])
    .map((r) => ({
      id: String(r.id),
      priority: r.priority,
      crop: r.crop ?? 'any',
      stage: r.stage ?? 'any',
      condition: describeCondition(r.condition),
      text: clip(r.text, 90),
      source: clip(r.source, 40),
      state: r.active ? 'active' : 'retired',
      all: `${r.crop ?? ''} ${r.stage ?? ''} ${r.text} ${r.source}`.toLowerCase(),
    }))
    .filter((r) => !needle || r.all.includes(needle));

  return (
    <>
      <PageSection title="Advice rules" region="the rules">
        <p className="cds--label-description section-intro">
          Each week a bulletin’s draft gets the advice of every active rule whose condition holds on the
          district’s outlook. Rules are retired rather than deleted, so a sent bulletin can always name the
          rule behind its advice.
        </p>
        {rules.isError ? (
          <LoadError what="the advice rules" error={rules.error} onRetry={() => rules.refetch()} />
        ) : null}
        {notice ? <p role="status">{notice}</p> : null}
        <SortableTable
          label="Advice rules"
          headers={HEADERS}
          rows={rows}
          empty={rules.isLoading ? 'Loading…' : 'No rule matches.'}
          toolbar={{
            label: 'Advice rule tools',
            content: (
              <>
                <TableSearch
                  labelText="Search rules"
                  placeholder="Crop, stage, text or source"
                  value={query}
                  onSearch={setQuery}
                />
                {canEdit ? (
                  <Button size="sm" onClick={() => setEditing('new')}>
                    New rule
                  </Button>
                ) : null}
              </>
            ),
          }}
          renderCell={(header, value) =>
            header === 'state' ? (
              <Tag type={value === 'active' ? 'green' : 'warm-gray'}>{String(value)}</Tag>
            ) : (
              String(value)
            )
          }
          renderActions={(row) => {
            const rule = rules.data?.find((r) => String(r.id) === row.id);
            return (
              <Button kind="ghost" size="sm" onClick={() => rule && setEditing(rule)}>
                {canEdit ? 'Edit' : 'View'}
                <span className="cds--visually-hidden"> rule {row.id}</span>
              </Button>
            );
          }}
        />
      </PageSection>
      {editing ? (
        <PageSection title={editing === 'new' ? 'New rule' : `Rule ${editing.id}`} region="the rule editor">
          <RuleEditor
            key={editing === 'new' ? 'new' : editing.id}
            rule={editing === 'new' ? null : editing}
            canEdit={canEdit}
            onDone={(saved) => {
              setEditing(null);
              setNotice(saved ? `Rule ${saved.id} saved.` : null);
            }}
          />
        </PageSection>
      ) : null}
    </>
  );
}
