import { useSyncExternalStore } from 'react';
import { outbox } from '../lib/outbox';

export const useOutbox = () => useSyncExternalStore(outbox.subscribe, outbox.getSnapshot, outbox.getSnapshot);
