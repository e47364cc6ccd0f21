// The brand owner's view of the published site: what is read, by whom (daily keys only), what is downloaded and what
// searches found nothing. Each chart has its table beside it, which is what screen readers are given.
import { useQuery } from '@tanstack/react-query';
import { BarElement, CategoryScale, Chart as ChartJS, Legend, LinearScale, Tooltip, type ChartData, type ChartOptions } from 'chart.js';
import { useState, type ReactNode } from 'react';
import { Bar } from 'react-chartjs-2';
import { api } from '@/lib/client/api';
import { formatNumber, SITE_LOCALE } from '@/lib/format';
import { When } from '@/components/ui/When';
import { QueryRoot } from '../QueryRoot';
import { INSIGHT_RANGES, RANGE_LABELS, type InsightRange, type InsightsReport, type InsightTable } from '@/lib/insights/views';

ChartJS.register(BarElement, CategoryScale, LinearScale, Tooltip, Legend);

// Our own inks (src/styles/global.css): plumb, a warm ochre and a soft ink, told apart by lightness as well as hue.
const INKS = { plumb: '#4b3a8c', ochre: '#c08a2b', ink: '#8c8376' };
const count = (n: number) => formatNumber(n, SITE_LOCALE);

function bars(labels: string[], series: { label: string; data: number[]; color: string }[], horizontal = false): { data: ChartData<'bar'>; options: ChartOptions<'bar'> } {
  return {
    data: { labels, datasets: series.map((s) => ({ label: s.label, data: s.data, backgroundColor: s.color, borderRadius: 3, maxBarThickness: 28 })) },
    options: {
      indexAxis: horizontal ? 'y' : 'x',
      responsive: true,
      maintainAspectRatio: false,
      animation: false,
      plugins: { legend: { display: series.length > 1, position: 'bottom', labels: { boxWidth: 12, color: '#57514a' } } },
      scales: {
        x: { ticks: { color: '#57514a', precision: 0 }, grid: { display: horizontal, color: '#e4dfd6' } },
        y: { ticks: { color: '#57514a', precision: 0 }, grid: { display: !horizontal, color: '#e4dfd6' }, beginAtZero: true },
      },
    },
  };
}

function Card({ title, intro, csv, children }: { title: string; intro: string; csv: string; children: ReactNode }) {
  return (
    <section className="rounded-lg border border-rule bg-card p-6" aria-label={title}>
      <div className="flex flex-wrap items-baseline justify-between gap-3">
        <h2 className="text-lg font-semibold">{title}</h2>
        <a className="text-sm font-semibold text-plumb underline-offset-2 hover:underline" href={csv} download>Export CSV</a>
      </div>
      <p className="mt-1 text-sm text-ink-soft">{intro}</p>
      <div className="mt-5">{children}</div>
    </section>
  );
}

/** A chart (hidden from screen readers) beside the table that carries the same figures. */
function ChartAndTable({ chart, height, table }: { chart: { data: ChartData<'bar'>; options: ChartOptions<'bar'> } | null; height: number; table: ReactNode }) {
  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
      {chart ? <div aria-hidden="true" style={{ height }}><Bar data={chart.data} options={chart.options} /></div> : null}
      <div className="overflow-x-auto">{table}</div>
    </div>
  );
}

function Table({ caption, head, rows, empty }: { caption: string; head: string[]; rows: ReactNode[][]; empty: string }) {
  if (rows.length === 0) return <p className="rounded-md bg-paper px-4 py-6 text-sm text-ink-soft">{empty}</p>;
  return (
    <table className="w-full text-left text-sm">
      <caption className="sr-only">{caption}</caption>
      <thead className="border-b border-rule text-xs uppercase tracking-wider text-ink-faint">
        <tr>{head.map((h, i) => <th key={h} scope="col" className={`py-2 pr-3 font-semibold ${i > 0 ? 'text-right' : ''}`}>{h}</th>)}</tr>
      </thead>
      <tbody>
        {rows.map((r, i) => (
          <tr key={i} className="border-b border-rule last:border-0">
            {r.map((cell, j) => (j === 0 ? <th key={j} scope="row" className="py-2 pr-3 font-normal">{cell}</th> : <td key={j} className="py-2 pr-3 text-right tabular-nums">{cell}</td>))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function Report({ brandId, report }: { brandId: string; report: InsightsReport }) {
  const csv = (what: InsightTable) => `/api/brands/${brandId}/insights.csv?range=${report.range}&what=${what}`;
  const topSections = report.sections.slice(0, 10);
  const topDownloads = report.downloads.slice(0, 10);
  const bucketWord = report.bucket === 'day' ? 'day' : report.bucket === 'week' ? 'ISO week' : 'month';
  return (
    <div className="grid gap-6">
      <dl className="grid grid-cols-2 gap-4 md:grid-cols-4">
        {[
          ['Page views', report.totals.views],
          ['Visitors (counted daily)', report.totals.visitors],
          ['Downloads', report.totals.downloads],
          ['Searches that found nothing', report.totals.emptySearches],
        ].map(([label, value]) => (
          <div key={label} className="rounded-lg border border-rule bg-card px-5 py-4">
            <dt className="text-sm text-ink-soft">{label}</dt>
            <dd className="mt-1 text-3xl font-semibold tabular-nums">{count(value as number)}</dd>
          </div>
        ))}
      </dl>

      <Card title="Over time" intro={`Page views, visitors and downloads per ${bucketWord} (UTC).`} csv={csv('timeline')}>
        <ChartAndTable
          height={260}
          chart={bars(report.timeline.map((b) => b.label), [
            { label: 'Page views', data: report.timeline.map((b) => b.views), color: INKS.plumb },
            { label: 'Visitors', data: report.timeline.map((b) => b.visitors), color: INKS.ochre },
            { label: 'Downloads', data: report.timeline.map((b) => b.downloads), color: INKS.ink },
          ])}
          table={<Table caption={`Views, visitors and downloads per ${bucketWord}`} head={[bucketWord, 'Views', 'Visitors', 'Downloads']} empty="Nothing yet." rows={report.timeline.map((b) => [b.label, count(b.views), count(b.visitors), count(b.downloads)])} />}
        />
      </Card>

      <div className="grid gap-6 xl:grid-cols-2">
        <Card title="Versions read" intro="Page views and daily visitors per published version." csv={csv('versions')}>
          <Table caption="Views per version" head={['Version', 'Views', 'Visitors']} empty="No version was read in this period. Share a link from Publishing to invite readers." rows={report.versions.map((v) => [`Version ${v.number}`, count(v.views), count(v.visitors)])} />
        </Card>
        <Card title="How visitors came" intro="Distinct visitors per day, by share link or signed in as a member." csv={csv('visitors')}>
          <Table caption="Visitors by share link" head={['Came through', 'Visitors', 'Views']} empty="No visits in this period." rows={report.visitors.map((v) => [v.label, count(v.visitors), count(v.views)])} />
        </Card>
      </div>

      <Card title="Sections read" intro="How often each section's heading came into view, by version (the ten most read in the chart)." csv={csv('sections')}>
        <ChartAndTable
          height={Math.max(140, topSections.length * 30 + 40)}
          chart={topSections.length ? bars(topSections.map((s) => `${s.title} (v${s.versionNumber})`), [{ label: 'Section views', data: topSections.map((s) => s.views), color: INKS.plumb }], true) : null}
          table={<Table caption="Views per section" head={['Section', 'Version', 'Views']} empty="No section views yet: they are counted when a reader scrolls a section's heading into view." rows={report.sections.map((s) => [s.title, count(s.versionNumber), count(s.views)])} />}
        />
      </Card>

      <Card title="Downloads" intro="PDFs, design tokens and files opened or saved from the site, by file and format. Images and fonts the page shows are not counted." csv={csv('downloads')}>
        <ChartAndTable
          height={Math.max(140, topDownloads.length * 30 + 40)}
          chart={topDownloads.length ? bars(topDownloads.map((d) => `${d.label} · ${d.format}`), [{ label: 'Downloads', data: topDownloads.map((d) => d.count), color: INKS.ochre }], true) : null}
          table={<Table caption="Downloads per file and format" head={['File', 'Format', 'Downloads']} empty="Nothing was downloaded in this period." rows={report.downloads.map((d) => [d.label, d.format, count(d.count)])} />}
        />
      </Card>

      <Card title="Searches that found nothing" intro="What readers looked for and did not find: words worth adding to a section, or a colour or file worth publishing." csv={csv('searches')}>
        <Table caption="Searches without results" head={['Search', 'Times', 'Last seen']} empty="Every search found something in this period." rows={report.searches.map((s) => [s.query, count(s.count), <When key="w" value={s.lastSeen} as="dateTime" />])} />
      </Card>
    </div>
  );
}

function Insights({ brandId }: { brandId: string }) {
  const [range, setRange] = useState<InsightRange>('4w');
  const report = useQuery({ queryKey: ['insights', brandId, range], queryFn: () => api<{ insights: InsightsReport }>(`/api/brands/${brandId}/insights?range=${range}`) });
  return (
    <div>
      <fieldset className="mb-6 flex flex-wrap items-center gap-2">
        <legend className="sr-only">Period</legend>
        {INSIGHT_RANGES.map((r) => (
          <label key={r} className={`cursor-pointer rounded-full border px-4 py-1.5 text-sm font-semibold ${r === range ? 'border-plumb bg-plumb-wash text-plumb-deep' : 'border-rule-strong bg-card text-ink-soft hover:text-ink'}`}>
            <input type="radio" name="insights-range" value={r} checked={r === range} onChange={() => setRange(r)} className="sr-only" />
            {RANGE_LABELS[r].label}
          </label>
        ))}
      </fieldset>
      {report.isPending && <p className="py-8 text-ink-soft" role="status">Gathering the figures…</p>}
      {report.isError && <p className="rounded-md bg-danger-wash px-4 py-3 text-danger" role="alert">The figures could not be loaded: {report.error.message}</p>}
      {report.data && <Report brandId={brandId} report={report.data.insights} />}
    </div>
  );
}

export default function InsightsPanel({ brandId }: { brandId: string }) {
  return (
    <QueryRoot>
      <Insights brandId={brandId} />
    </QueryRoot>
  );
}
