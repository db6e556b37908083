import type { Metadata } from 'next';
import { DEMAND_CATALOGUE } from '@/lib/engine/demand';
import { requirePageUser } from '@/lib/server/auth/page-guard';
import { getSettings } from '@/lib/server/data/settings';
import { SettingsForm } from './_components/settings-form';

export const metadata: Metadata = { title: 'Settings' };

export default async function SettingsPage() {
  const user = await requirePageUser(['coordinator'], '/office/settings');
  const settings = await getSettings(user);
  const kinds = Object.values(DEMAND_CATALOGUE).map((e) => ({ kind: e.kind, label: e.label, unit: e.unit, catalogue: e.litresPerHeadPerDay }));
  return (
    <div className="space-y-6">
      <h1 className="text-3xl font-bold text-slate">Settings</h1>
      <p className="max-w-prose text-stone">
        These figures feed the screening. It is a first check, not an engineering design: local codes and licensed practice come first.
      </p>
      <SettingsForm initial={settings} kinds={kinds} />
    </div>
  );
}
