import { useApiErrors } from './useApiErrors';
import { fetchExport } from '@/services/calibrations';

/** Downloads a session's C header or JSON (one record's, or the current one) as a file, with refusals as messages. */
export function useCalibrationDownload() {
  const { run, busy } = useApiErrors();

  async function download(sessionId: number, format: 'h' | 'json', record?: number): Promise<void> {
    const file = await run(() => fetchExport(sessionId, format, record));
    if (!file) return;
    const url = URL.createObjectURL(file.blob);
    const link = document.createElement('a');
    link.href = url;
    link.download = file.fileName;
    document.body.append(link);
    link.click();
    link.remove();
    setTimeout(() => URL.revokeObjectURL(url), 10_000);
  }

  return { download, busy };
}
