/** Reads a response body until it ends or fails; returns the text that arrived and the failure. */
export async function readAll(response: Response): Promise<{ text: string; failure?: unknown }> {
  const reader = response.body!.getReader();
  const decoder = new TextDecoder();
  let text = '';
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) return { text };
      text += decoder.decode(value, { stream: true });
    }
  } catch (failure) {
    return { text, failure };
  }
}
