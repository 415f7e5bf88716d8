// Prints the one closing line that `npm test` promises: "N passed, N failed".
class SummaryReporter {
  onRunComplete(_contexts, results) {
    const failed = results.numFailedTests + results.numRuntimeErrorTestSuites;
    process.stdout.write(`\n${results.numPassedTests} passed, ${failed} failed\n`);
  }
}
module.exports = SummaryReporter;
