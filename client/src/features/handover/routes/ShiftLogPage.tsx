import { Stack, Tabs } from '@mantine/core';
import { useSearchParams } from 'react-router-dom';
import { PageHeader } from '../../../components/PageHeader';
import { useSignedInUser } from '../../auth';
import { mayWriteHandover } from '../acknowledge-rule';
import { CurrentShiftPanel } from '../components/CurrentShiftPanel';
import { HandoverDetail } from '../components/HandoverDetail';
import { HandoverHistory } from '../components/HandoverHistory';
import { PendingHandovers } from '../components/PendingHandovers';
import { WriteHandoverPanel } from '../components/WriteHandoverPanel';

type View = 'now' | 'past';

/**
 * The shift log. The address keeps the view (?view=past) and an open note (?note=12), so a
 * note can be linked to and printed from its own address.
 */
export function ShiftLogPage() {
  const user = useSignedInUser();
  const [params, setParams] = useSearchParams();
  const noteId = Number(params.get('note'));
  const openNote = Number.isInteger(noteId) && noteId > 0 ? noteId : null;
  const view: View = params.get('view') === 'past' ? 'past' : 'now';

  return (
    <>
      <PageHeader title="Shift log" description="Hand the desk to the next shift, acknowledge the last one, look back at past notes." />
      {openNote !== null ? (
        <HandoverDetail id={openNote} onBack={() => setParams({ view: 'past' })} />
      ) : (
        <Stack gap="lg">
          <PendingHandovers user={user} />
          <CurrentShiftPanel />
          <Tabs value={view} onChange={(value) => setParams(value === 'past' ? { view: 'past' } : {})} keepMounted={false}>
            <Tabs.List mb="md">
              {mayWriteHandover(user) && <Tabs.Tab value="now">Write handover</Tabs.Tab>}
              <Tabs.Tab value="past">Past notes</Tabs.Tab>
            </Tabs.List>
            {mayWriteHandover(user) && (
              <Tabs.Panel value="now">
                <WriteHandoverPanel />
              </Tabs.Panel>
            )}
            <Tabs.Panel value="past">
              <HandoverHistory onOpen={(id) => setParams({ note: String(id) })} />
            </Tabs.Panel>
          </Tabs>
        </Stack>
      )}
    </>
  );
}
