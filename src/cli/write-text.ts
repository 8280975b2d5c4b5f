/** Text to a stream, resolved once the stream has taken it (a large merged log to a slow pipe waits for it). */
export function writeText(stream: NodeJS.WritableStream, text: string): Promise<void> {
  return new Promise((resolve, reject) => {
    stream.write(text, (error) => (error ? reject(error) : resolve()));
  });
}
