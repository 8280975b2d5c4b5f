/** Reading a clip on the phone: the container, every frame decoded in a worker with its own timestamp. */
export type { ClipProbe, GreyClip } from '../motion';
