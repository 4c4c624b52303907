package org.targetbench.cli;

import org.targetbench.source.Webcams;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Spec;

import java.io.PrintWriter;
import java.util.concurrent.Callable;

@Command(name = "devices", mixinStandardHelpOptions = true,
        description = {"Lists the cameras that 'track --source webcam:INDEX' can use, or says there are none.",
                "Discovery waits at most 10 s. On Linux the webcam driver needs Debian's libv4l-0 package."})
final class DevicesCommand implements Callable<Integer> {
    @Spec CommandSpec spec;

    @Override
    public Integer call() {
        PrintWriter w = spec.commandLine().getOut();
        Webcams.Discovery d = Webcams.discover(Webcams.DISCOVERY_TIMEOUT);
        if (d.cameras().isEmpty()) {
            w.println("No camera found: " + d.problem() + ".");
        } else {
            w.println(d.cameras().size() + " camera" + (d.cameras().size() == 1 ? "" : "s") + ":");
            for (Webcams.CameraInfo c : d.cameras())
                w.println("  webcam:" + c.index() + "  " + c.name() + (c.sizes().isEmpty() ? "" : "  (" + String.join(", ", c.sizes()) + ")"));
        }
        w.flush();
        return 0;
    }
}
