import { useEffect, useMemo, useState } from 'react';
import { useSearchParams } from 'react-router';
import { toast } from 'sonner';
import { Camera } from 'lucide-react';
import type { CalloutDto, PhotoDto, TeardownDto } from '@splitcase/contracts';
import { Card, EmptyState, Spinner } from '@/components/page';
import { ErrorPanel } from '@/components/error-boundary';
import { mutationErrorMessage } from '@/lib/unpublish-confirm';
import { usePhotos } from '../api/get-photos';
import { useCalloutTargets } from '../api/get-callout-targets';
import { useCreateCallout } from '../api/create-callout';
import { useUpdateCallout } from '../api/update-callout';
import { useDeleteCallout } from '../api/delete-callout';
import { useUpdatePhoto } from '../api/update-photo';
import { useDeletePhoto } from '../api/delete-photo';
import { Filmstrip } from './filmstrip';
import { LithiumCaution } from '@/components/safety';
import { PhotoDetails, type PhotoValues } from './photo-details';
import { PhotoStage } from './photo-stage';
import { PinPanel, type PinValues } from './pin-panel';
import { UploadPanel } from './upload-panel';
import { useUploadQueue } from './use-upload-queue';

const nextStepIn = (photos: PhotoDto[], layer: number) => Math.max(0, ...photos.filter((p) => p.layer === layer).map((p) => p.step)) + 1;

/** The photos section of a teardown: upload, filmstrip by layer, the stage with pins, details. */
export function PhotosSection({ teardown }: { teardown: TeardownDto }) {
  const canEdit = teardown.permissions.edit;
  const photos = usePhotos(teardown.id);
  const targets = useCalloutTargets(teardown.id, canEdit);
  const queue = useUploadQueue(teardown);
  const [params, setParams] = useSearchParams();
  const [draft, setDraft] = useState<{ x: number; y: number } | null>(null);
  const [uploadLayer, setUploadLayer] = useState(1);

  const list = useMemo(() => photos.data?.photos ?? [], [photos.data]);
  const requested = Number(params.get('photo'));
  const current = list.find((p) => p.id === requested) ?? list[0] ?? null;
  const selectedPin = Number(params.get('pin')) || null;

  const select = (photoId: number | null, pinId: number | null = null) => {
    setDraft(null);
    const next = new URLSearchParams(params);
    if (photoId) next.set('photo', String(photoId));
    else next.delete('photo');
    if (pinId) next.set('pin', String(pinId));
    else next.delete('pin');
    setParams(next, { replace: true });
  };
  const selectPin = (pinId: number | null) => current && select(current.id, pinId);

  // New uploads go to the layer on the stage by default.
  useEffect(() => {
    if (current) setUploadLayer(current.layer);
  }, [current?.id]);

  const createPin = useCreateCallout(teardown.id);
  const updatePin = useUpdateCallout(teardown.id);
  const deletePin = useDeleteCallout(teardown.id);
  const updatePhoto = useUpdatePhoto(teardown.id);
  const deletePhoto = useDeletePhoto(teardown.id);

  if (photos.isPending) return <Spinner />;
  if (photos.isError) return <ErrorPanel error={photos.error} onRetry={() => photos.refetch()} />;
  const { limits } = photos.data;

  // Each write asks first when the teardown is published (withUnpublishConfirm in the api/ files);
  // choosing to keep it published is not an error to show.
  const failed =
    (prefix = '') =>
    (e: unknown) => {
      const message = mutationErrorMessage(e);
      if (message) toast.error(`${prefix}${message}`);
    };
  const quiet = () => {};

  const placePin = (v: PinValues) =>
    current &&
    void createPin
      .mutateAsync({ photoId: current.id, body: { x: draft!.x, y: draft!.y, label: v.label, partId: v.partId, findingId: v.findingId } })
      .then(({ callout }) => select(current.id, callout.id))
      .catch(quiet);
  const savePin = (c: CalloutDto, v: PinValues) =>
    void updatePin
      .mutateAsync({ id: c.id, body: { label: v.label, partId: v.partId, findingId: v.findingId } })
      .then(() => toast.success(`Pin ${c.number} saved.`))
      .catch(quiet);
  const movePin = (c: CalloutDto, pos: { x: number; y: number }) => void updatePin.mutateAsync({ id: c.id, body: pos }).catch(failed(`Pin ${c.number} was not moved: `));
  const removePin = (c: CalloutDto) =>
    void deletePin
      .mutateAsync({ id: c.id })
      .then(() => selectPin(null))
      .catch(failed());
  const savePhoto = (v: PhotoValues) =>
    current &&
    void updatePhoto
      .mutateAsync({ id: current.id, body: { caption: v.caption.trim() || null, layer: v.layer, step: v.step } })
      .then(() => toast.success('Photo details saved.'))
      .catch(quiet);
  const removePhoto = () =>
    current &&
    void deletePhoto
      .mutateAsync({ id: current.id })
      .then(() => {
        toast.success('Photo and its pins deleted.');
        select(null);
      })
      .catch(failed());

  const upload = canEdit && (
    <UploadPanel
      limits={limits}
      queue={queue}
      layer={uploadLayer}
      onLayerChange={setUploadLayer}
      nextStep={(layer) => nextStepIn(list, layer) + queue.items.filter((i) => i.layer === layer && i.status !== 'done' && i.status !== 'refused').length}
      compact={list.length > 0}
    />
  );

  return (
    <div className="space-y-4">
      {canEdit && <LithiumCaution cell={teardown.cell} collapsed={list.length > 0} />}
      {upload}
      {!current ? (
        <Card>
          <EmptyState
            icon={<Camera className="size-8" aria-hidden />}
            message={canEdit ? 'No photos yet. Drop the first photos of the opened device above, one layer at a time.' : 'No photos of this teardown yet.'}
          />
        </Card>
      ) : (
        <Card>
          <div className="border-b border-graphite-100 px-4 pt-3">
            <Filmstrip photos={list} selectedId={current.id} onSelect={(id) => select(id)} />
          </div>
          <div className="grid gap-4 p-4 lg:grid-cols-[minmax(0,1fr)_20rem]">
            <div className="min-w-0 space-y-2">
              <PhotoStage
                photo={current}
                canEdit={canEdit}
                selectedId={selectedPin}
                draft={draft}
                onSelect={selectPin}
                onPlace={(pos) => {
                  setDraft(pos);
                  createPin.reset();
                  const next = new URLSearchParams(params);
                  next.delete('pin');
                  setParams(next, { replace: true });
                }}
                onMove={movePin}
              />
              <p className="text-sm text-graphite-700">
                <span className="num font-medium">
                  Layer {current.layer} · step {current.step}
                </span>
                {current.caption ? ` — ${current.caption}` : ''}
              </p>
            </div>
            <div className="space-y-5">
              <PhotoDetails
                photo={current}
                canEdit={canEdit}
                save={{ busy: updatePhoto.isPending, error: updatePhoto.error, run: savePhoto }}
                remove={{ busy: deletePhoto.isPending, run: removePhoto }}
              />
              <div className="border-t border-graphite-100 pt-4">
                <PinPanel
                  callouts={current.callouts}
                  canEdit={canEdit}
                  selectedId={selectedPin}
                  onSelect={(id) => {
                    setDraft(null);
                    updatePin.reset();
                    selectPin(id);
                  }}
                  draftNumber={draft ? Math.max(0, ...current.callouts.map((c) => c.number)) + 1 : null}
                  targets={targets.data}
                  create={{ busy: createPin.isPending, error: createPin.error, run: placePin }}
                  update={{ busy: updatePin.isPending, error: updatePin.error, run: savePin }}
                  remove={removePin}
                  onCancelDraft={() => setDraft(null)}
                />
              </div>
            </div>
          </div>
        </Card>
      )}
    </div>
  );
}
