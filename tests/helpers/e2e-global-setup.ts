import { prepareDatabase } from './global-setup';

export default function globalSetup(): Promise<void> {
  return prepareDatabase('kerfcast_e2e');
}
