export { createStripeFake, signPayload, API_VERSION, type FakeOptions } from './server';
