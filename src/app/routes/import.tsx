import { PageHeader } from '../../components/ui/page-header';

export function ImportRoute() {
  return (
    <>
      <PageHeader
        title="Import"
        lead="Drop flight-controller CSV logs; they are read and analysed on this device, even offline."
      />
      <p className="rounded border border-dashed border-line bg-paper-raised p-6 text-sm text-ink-soft">
        The log reader is being wired to this page.
      </p>
    </>
  );
}
