// localStorage for unit tests in Node; with a size limit in characters, like a browser's quota.
export function memoryStorage(limitChars = Number.POSITIVE_INFINITY): Storage {
  const items = new Map<string, string>();
  return {
    get length() {
      return items.size;
    },
    clear: () => items.clear(),
    getItem: (key) => items.get(key) ?? null,
    key: (index) => [...items.keys()][index] ?? null,
    removeItem: (key) => void items.delete(key),
    setItem: (key, value) => {
      if (String(value).length > limitChars) throw new Error("QuotaExceededError");
      items.set(key, String(value));
    },
  };
}
