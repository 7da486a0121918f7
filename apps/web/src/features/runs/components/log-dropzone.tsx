import { useDropzone } from 'react-dropzone';
import { FileUp } from 'lucide-react';

/** Where a log is dropped (or chosen); a file that is not a text log is refused with what to do. */
export function LogDropzone({ reading, onFile, onRefused }: { reading: string | null; onFile: (file: File) => void; onRefused: (message: string) => void }) {
  const dropzone = useDropzone({
    multiple: false,
    accept: { 'text/csv': ['.csv'], 'text/tab-separated-values': ['.tsv'], 'text/plain': ['.txt', '.log', '.dat'] },
    onDropAccepted: (files) => files[0] && onFile(files[0]),
    onDropRejected: (rejections) => onRefused(`${rejections[0]?.file.name ?? 'That file'} is not a CSV or TSV log. Export the log as text (.csv, .tsv or .txt) and drop it again.`),
  });
  return (
    <div
      {...dropzone.getRootProps()}
      className={`flex min-h-36 cursor-pointer flex-col items-center justify-center gap-2 rounded-lg border-2 border-dashed px-6 py-8 text-center text-sm ${dropzone.isDragActive ? 'border-copper-500 bg-copper-50' : 'border-graphite-200 hover:border-copper-400'}`}
    >
      <input {...dropzone.getInputProps()} aria-label="Log file (CSV or TSV)" />
      <FileUp className="size-8 text-graphite-300" aria-hidden />
      {reading !== null ? (
        <p className="text-graphite-600">Reading the columns of {reading}…</p>
      ) : (
        <>
          <p className="font-medium text-graphite-800">Drop a CSV or TSV log here, or click to choose one</p>
          <p className="text-graphite-500">Electronic load, USB meter or thermocouple logger exports; up to a million rows and more. You map the columns next.</p>
        </>
      )}
    </div>
  );
}
