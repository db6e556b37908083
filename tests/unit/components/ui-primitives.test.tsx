// Rendered to static markup on the server, read back with a DOM (happy-dom) to check classes and aria wiring.
// @vitest-environment happy-dom
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { Button, ButtonLink, buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Input, Select, TextArea } from '@/components/ui/control';
import { Field } from '@/components/ui/field';
import { TapLink } from '@/components/ui/tap-link';

/** The markup as a detached element, to read attributes and classes. */
function render(node: React.ReactNode): Element {
  const html = renderToStaticMarkup(node);
  const doc = new DOMParser().parseFromString(`<body>${html}</body>`, 'text/html');
  const first = doc.body.firstElementChild;
  if (!first) throw new Error(`nothing rendered: ${html}`);
  return first;
}
const classesOf = (el: Element | null) => new Set((el?.getAttribute('class') ?? '').split(/\s+/).filter(Boolean));

describe('Button', () => {
  it('draws each variant with its own colours at thumb height, and never submits by accident', () => {
    const primary = render(<Button>Save</Button>);
    expect(primary.tagName).toBe('BUTTON');
    expect(primary.getAttribute('type')).toBe('button');
    expect([...classesOf(primary)]).toEqual(expect.arrayContaining(['min-h-12', 'rounded-md', 'font-bold', 'bg-slate', 'text-white', 'px-4']));
    expect(classesOf(render(<Button variant="secondary">Back</Button>))).toEqual(
      new Set(['min-h-12', 'rounded-md', 'font-bold', 'border-2', 'border-slate', 'text-slate', 'disabled:opacity-50', 'px-4']),
    );
    expect([...classesOf(render(<Button variant="danger">Delete</Button>))]).toEqual(expect.arrayContaining(['border-2', 'border-clay', 'text-clay']));
    expect([...classesOf(render(<Button variant="caution">Save anyway</Button>))]).toEqual(expect.arrayContaining(['border-ochre', 'text-ochre']));
    const quiet = classesOf(render(<Button variant="quiet">Remove</Button>));
    expect([...quiet]).toEqual(expect.arrayContaining(['border-2', 'border-stone']));
    expect(quiet.has('text-slate')).toBe(false);
    expect(quiet.has('bg-slate')).toBe(false);
  });

  it('sizes change the padding and text, and a caller class wins over the variant', () => {
    expect([...classesOf(render(<Button size="lg">Send</Button>))]).toEqual(expect.arrayContaining(['px-5', 'text-lg']));
    const sm = classesOf(render(<Button size="sm">Remove</Button>));
    expect(sm.has('px-3')).toBe(true);
    expect(sm.has('px-4')).toBe(false);
    const xl = classesOf(render(<Button size="xl">Save this run</Button>));
    expect(xl.has('min-h-14')).toBe(true);
    expect(xl.has('min-h-12')).toBe(false);
    const wide = classesOf(render(<Button size="wide">Retry</Button>));
    expect(wide.has('w-full')).toBe(true);
    expect(wide.has('px-4')).toBe(false);
    const own = classesOf(render(<Button className="mt-2 disabled:opacity-60">Go</Button>));
    expect(own.has('mt-2')).toBe(true);
    expect(own.has('disabled:opacity-60')).toBe(true);
    expect(own.has('disabled:opacity-70')).toBe(false);
  });

  it('passes a submit type, disabled state and attributes through', () => {
    const el = render(
      <Button type="submit" disabled aria-describedby="why">
        Send
      </Button>,
    );
    expect(el.getAttribute('type')).toBe('submit');
    expect(el.hasAttribute('disabled')).toBe(true);
    expect(el.getAttribute('aria-describedby')).toBe('why');
    expect(el.textContent).toBe('Send');
  });
});

describe('ButtonLink', () => {
  it('is a link to its href with the look of the same button', () => {
    const el = render(
      <ButtonLink href="/office/farms/new" variant="primary">
        Add a farm
      </ButtonLink>,
    );
    expect(el.tagName).toBe('A');
    expect(el.getAttribute('href')).toBe('/office/farms/new');
    const classes = classesOf(el);
    for (const c of classesOf(render(<Button variant="primary">x</Button>))) expect(classes.has(c)).toBe(true);
    expect([...classes]).toEqual(expect.arrayContaining(['inline-flex', 'items-center', 'no-underline']));
  });

  it('as a plain <a> keeps a download link a download', () => {
    const el = render(
      <ButtonLink plain href="/api/visits/export.csv?status=booked" variant="secondary" download>
        Download
      </ButtonLink>,
    );
    expect(el.tagName).toBe('A');
    expect(el.getAttribute('href')).toBe('/api/visits/export.csv?status=booked');
    expect(el.hasAttribute('download')).toBe(true);
    expect(classesOf(el).has('border-slate')).toBe(true);
    expect(buttonClasses({ variant: 'secondary' }).split(' ')).not.toContain('inline-flex');
  });
});

describe('Field', () => {
  it('labels its control and, with no message, leaves it valid and undescribed', () => {
    const el = render(
      <Field id="farm-name" label="Name">
        {(control) => <Input {...control} />}
      </Field>,
    );
    const label = el.querySelector('label');
    const input = el.querySelector('input');
    expect(label?.getAttribute('for')).toBe('farm-name');
    expect(label?.textContent).toBe('Name');
    expect(input?.id).toBe('farm-name');
    expect(input?.getAttribute('aria-invalid')).toBe('false');
    expect(input?.hasAttribute('aria-describedby')).toBe(false);
    expect(el.querySelector('p')).toBeNull();
  });

  it('shows a message at the field, marks the control invalid and describes it by the message', () => {
    const el = render(
      <Field id="lat" label="Latitude" hint="Decimal degrees" message="Type a number, like 52.1.">
        {(control) => <Input {...control} />}
      </Field>,
    );
    const input = el.querySelector('input');
    expect(input?.getAttribute('aria-invalid')).toBe('true');
    const note = el.querySelector(`#${input?.getAttribute('aria-describedby')}`);
    expect(note?.textContent).toBe('Type a number, like 52.1.');
    expect([...classesOf(note)]).toEqual(expect.arrayContaining(['font-bold', 'text-clay']));
    // The message takes the hint's place.
    expect(el.textContent).not.toContain('Decimal degrees');
  });

  it('shows the hint while there is no message', () => {
    const el = render(
      <Field id="lat" label="Latitude" hint="Decimal degrees">
        {(control) => <Input {...control} />}
      </Field>,
    );
    const note = el.querySelector(`#${el.querySelector('input')?.getAttribute('aria-describedby')}`);
    expect(note?.textContent).toBe('Decimal degrees');
    expect(classesOf(note).has('text-stone')).toBe(true);
  });

  it('holds the record check slot under the control and describes the control by it too', () => {
    const el = render(
      <Field
        id="foresight"
        label="Foresight"
        hint=""
        invalid
        issue={
          <p role="alert" className="font-bold text-clay">
            Foresight must be at most 6.00 m.
          </p>
        }
      >
        {(control) => <Input {...control} />}
      </Field>,
    );
    const input = el.querySelector('input');
    expect(input?.getAttribute('aria-invalid')).toBe('true');
    const ids = (input?.getAttribute('aria-describedby') ?? '').split(' ');
    expect(ids).toEqual(['foresight-note', 'foresight-issue']);
    expect(el.querySelector('#foresight-issue [role="alert"]')?.textContent).toBe('Foresight must be at most 6.00 m.');
  });
});

describe('controls, cards and tap links', () => {
  it('inputs, selects and text areas share the control look; a caller class wins', () => {
    const input = classesOf(render(<Input className="figure" />));
    expect([...input]).toEqual(expect.arrayContaining(['mt-1', 'block', 'min-h-12', 'w-full', 'border-2', 'border-stone', 'bg-white', 'text-lg', 'figure']));
    const select = classesOf(render(<Select className="text-base" />));
    expect(select.has('text-base')).toBe(true);
    expect(select.has('text-lg')).toBe(false);
    expect(classesOf(render(<TextArea />)).has('py-2')).toBe(true);
  });

  it("the field book's controls are taller and larger, with no form spacing", () => {
    const phone = classesOf(render(<Input look="phone" className="figure text-2xl" />));
    expect([...phone]).toEqual(expect.arrayContaining(['min-h-14', 'w-full', 'border-2', 'border-stone', 'px-3', 'text-2xl', 'figure']));
    for (const c of ['min-h-12', 'mt-1', 'block', 'px-2', 'text-xl', 'text-lg']) expect(phone.has(c)).toBe(false);
    expect(render(<Select look="phone" />).tagName).toBe('SELECT');
  });

  it('a card is a white rounded panel whose border follows its tone, drawn as the element asked for', () => {
    const plain = render(<Card>Text</Card>);
    expect(plain.tagName).toBe('DIV');
    expect(classesOf(plain)).toEqual(new Set(['rounded-md', 'bg-white', 'border', 'border-rule', 'p-4']));
    const list = render(
      <Card as="ul" padding="none" className="divide-y divide-rule">
        <li>One</li>
      </Card>,
    );
    expect(list.tagName).toBe('UL');
    expect(classesOf(list)).toEqual(new Set(['rounded-md', 'bg-white', 'border', 'border-rule', 'divide-y', 'divide-rule']));
    const strong = render(
      <Card as="section" tone="strong" padding="md" aria-label="Assign">
        x
      </Card>,
    );
    expect(strong.tagName).toBe('SECTION');
    expect(strong.getAttribute('aria-label')).toBe('Assign');
    expect([...classesOf(strong)]).toEqual(expect.arrayContaining(['border-2', 'border-slate', 'p-3']));
  });

  it('a tap link is a link at thumb height', () => {
    const el = render(<TapLink href="/sheets/v1">Read the sheet</TapLink>);
    expect(el.getAttribute('href')).toBe('/sheets/v1');
    expect([...classesOf(el)]).toEqual(expect.arrayContaining(['inline-flex', 'min-h-12', 'items-center', 'font-bold']));
  });
});
