// The report's frame: a column as wide as an A4 page's print area (so charts drawn on screen fit
// the paper), the page rules for printing, and the document title the PDF is saved under.
import { useEffect, type ReactNode } from "react";

/** A4 is 210 mm wide; with 14 mm margins the print area is 182 mm ≈ 688 CSS px. */
export const reportWidthPx = 680;

/** Margin boxes repeat the caution and the page number on every printed page. */
function PageRules({ footerText }: { footerText: string }) {
  const css = `@media print {
  @page {
    size: A4 portrait;
    margin: 14mm 14mm 18mm 14mm;
    @bottom-left { content: ${JSON.stringify(footerText)}; font-size: 8pt; color: #000; width: 150mm; }
    @bottom-right { content: "Page " counter(page) " of " counter(pages); font-size: 8pt; color: #000; }
  }
}`;
  return <style>{css}</style>;
}

interface ReportDocumentProps {
  documentTitle: string;
  footerText: string;
  children: ReactNode;
}

export function ReportDocument({ documentTitle, footerText, children }: ReportDocumentProps) {
  useEffect(() => {
    const before = document.title;
    document.title = documentTitle;
    return () => {
      document.title = before;
    };
  }, [documentTitle]);
  return (
    <article
      data-report=""
      aria-label="Campaign report"
      className="mx-auto flex w-full flex-col gap-10"
      style={{ maxWidth: `${reportWidthPx}px` }}
    >
      <PageRules footerText={footerText} />
      {children}
    </article>
  );
}
