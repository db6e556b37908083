import { writeFileSync } from 'node:fs';
import { renderSheetPdf } from '@/lib/server/sheets/pdf';
import { buildSheetView } from '@/lib/shared/sheet/view-model';
import { brandtLikeSource, gravitySource } from './tests/unit/sheet/fixture';
const g = await renderSheetPdf(buildSheetView(gravitySource(), 'metric'), 'a4');
writeFileSync('/tmp/shots/gravity.pdf', g);
const b = await renderSheetPdf(buildSheetView(brandtLikeSource(), 'us'), 'letter');
writeFileSync('/tmp/shots/brandt-us.pdf', b);
console.log('ok');
