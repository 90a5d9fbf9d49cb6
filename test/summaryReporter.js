// Prints one plain closing line, "tests: N passed, N failed", that any CI log reader can count.
class SummaryReporter {
  onRunComplete(_contexts, results) {
    const skipped = results.numPendingTests + results.numTodoTests;
    process.stdout.write(`\ntests: ${results.numPassedTests} passed, ${results.numFailedTests} failed${skipped ? `, ${skipped} skipped` : ''}\n`);
  }
}
module.exports = SummaryReporter;
