/**
 * Imported FIRST by the editors' integration tests: the deposit tests' fresh temporary data
 * folder, plus a fake SMTP server on a free port so decision mails are captured in the test DB.
 */
import "./deposit-env";

process.env.FAKE_SMTP_PORT = "0";
