/**
 * Starts the browser's download of some bytes or text as a file: the one way the board's design
 * file, the print room's booklet and the fabric table's CSV are saved.
 */
export function downloadFile(contents: BlobPart, fileName: string, type: string): void {
  const url = URL.createObjectURL(new Blob([contents], { type }))
  const link = document.createElement('a')
  link.href = url
  link.download = fileName
  document.body.append(link)
  link.click()
  link.remove()
  // Some browsers read the URL after click() returns; give them a moment before letting it go.
  setTimeout(() => URL.revokeObjectURL(url), 10_000)
}
