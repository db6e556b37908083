import { TapLink } from '@/components/ui/tap-link';

const LINKS = [
  { href: '/office', label: 'Visits' },
  { href: '/office/visits/new', label: 'Plan a visit' },
  { href: '/office/map', label: 'Map' },
  { href: '/office/commissioning', label: 'Installed rams' },
  { href: '/office/farms', label: 'Farms' },
  { href: '/office/people', label: 'People' },
  { href: '/office/settings', label: 'Settings' },
];

/** The office's sections, as plain links (each a ≥ 48 px target). */
export function OfficeNav() {
  return (
    <nav aria-label="Office" className="border-b border-rule bg-white">
      <ul className="mx-auto flex max-w-6xl flex-wrap gap-1 px-4">
        {LINKS.map((l) => (
          <li key={l.href}>
            <TapLink href={l.href} className="px-3 text-slate no-underline hover:underline">
              {l.label}
            </TapLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
