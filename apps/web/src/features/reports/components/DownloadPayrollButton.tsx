import { Button } from '@fluentui/react-components';
import { ArrowDownloadRegular } from '@fluentui/react-icons';
import { useMutation } from '@tanstack/react-query';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { useNotify } from '@/ui/notify';
import { downloadPayrollCsv } from '../api/reports.queries';

/** Fetches the payroll CSV with the signed-in session and saves it as a file. */
export function DownloadPayrollButton({ periodId }: { periodId: string }) {
  const notify = useNotify();
  const download = useMutation({
    mutationFn: () => downloadPayrollCsv(periodId),
    onSuccess: (fileName) => notify(`Saved ${fileName}`),
  });
  return (
    <>
      <Button
        appearance="primary"
        icon={<ArrowDownloadRegular />}
        disabled={download.isPending}
        onClick={() => download.mutate()}
      >
        {download.isPending ? 'Preparing payroll CSV…' : 'Download payroll CSV'}
      </Button>
      {download.isError && (
        <ErrorBanner error={download.error} title="The payroll CSV could not be downloaded" />
      )}
    </>
  );
}
