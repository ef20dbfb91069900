export { startStripeFake, type FakeDelivery, type FakeEvent, type StripeFake, type StripeFakeOptions } from './server';
