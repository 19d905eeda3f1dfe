package dev.quern.run;

/** Where a long build says how far it has come. */
public interface Progress {

    /** Says nothing: for tests, libraries and output that is not a terminal. */
    Progress SILENT = new Progress() {
        @Override
        public void stage(String name) {
        }

        @Override
        public void rows(long written) {
        }

        @Override
        public void done() {
        }
    };

    /** A new stage has started. */
    void stage(String name);

    /** So many rows are written so far; called often, so implementations throttle. */
    void rows(long written);

    /** The build is over, successfully or not. */
    void done();
}
