import { measurementsDownloadPath, openDataLicence } from "@/lib/open-data";

const downloadLink =
  "inline-flex items-center gap-2 rounded border border-ink px-3 py-1.5 text-sm font-semibold hover:bg-ink hover:text-paper-raised focus-visible:bg-ink focus-visible:text-paper-raised";

/** The current revision's measurements as files, for readers who want the numbers in a spreadsheet or a script. */
export function OpenDataDownloads({ slug, revisionNumber, retracted }: { slug: string; revisionNumber: number; retracted: boolean }) {
  return (
    <section aria-labelledby="open-data-heading" className="max-w-3xl space-y-3 rounded border border-rule bg-paper-raised px-4 py-4">
      <h2 id="open-data-heading" className="font-serif text-2xl">
        Measurements as open data
      </h2>
      <p className="text-sm text-ink-soft">
        Every measurement of revision {revisionNumber} as one row, with its run&apos;s supply and conditions, the expanded uncertainty (k = 2) and every
        number behind its verdict. Each numeric column&apos;s name ends in its unit (<code className="figure">value_W</code>,{" "}
        <code className="figure">value_A</code> …), and numbers carry every stored digit.
      </p>
      {retracted ? (
        <p role="note" className="border-l-4 border-verdict-above bg-copper-wash px-3 py-2 text-sm font-semibold text-copper-deep">
          This report was retracted. The files stay available for the record, and every row says so (
          <code className="figure">report_retracted</code> is true): do not use these figures as results.
        </p>
      ) : null}
      <ul className="flex flex-wrap gap-3">
        <li>
          <a href={measurementsDownloadPath(slug, "csv")} download className={downloadLink}>
            Download CSV<span className="sr-only"> of the measurements</span>
          </a>
        </li>
        <li>
          <a href={measurementsDownloadPath(slug, "json")} download className={downloadLink}>
            Download JSON<span className="sr-only"> of the measurements, with column units and licence</span>
          </a>
        </li>
      </ul>
      <p className="text-xs text-ink-faint">
        Free to reuse under{" "}
        <a href={openDataLicence.url} className="underline underline-offset-2 hover:text-copper" rel="license">
          {openDataLicence.name}
        </a>
        : credit Benchplate and the report&apos;s author, and link this report. A correction publishes a new revision and changes these files; the{" "}
        <a href="/feed.xml" className="underline underline-offset-2 hover:text-copper">
          Atom feed
        </a>{" "}
        announces each one.
      </p>
    </section>
  );
}
