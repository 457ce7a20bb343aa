package rdstab.cli.command;

import java.util.Map;
import rdstab.solver.error.InputException;
import rdstab.solver.sweep.Shard;

/**
 * The shard of a Slurm job-array task: index = SLURM_ARRAY_TASK_ID − SLURM_ARRAY_TASK_MIN (MIN taken
 * as 0 when unset), count = SLURM_ARRAY_TASK_COUNT, or MAX − MIN + 1 when COUNT is unset. The array
 * must be contiguous (e.g. --array=0-7 or 1-8; not 0-14:2). Without SLURM_ARRAY_TASK_ID: the whole sweep.
 */
final class SlurmShard {

    private SlurmShard() {
    }

    static Shard fromEnvironment(Map<String, String> env) {
        String id = env.get("SLURM_ARRAY_TASK_ID");
        if (id == null || id.isBlank()) {
            return Shard.ALL;
        }
        int task = number(env, "SLURM_ARRAY_TASK_ID");
        int min = env.containsKey("SLURM_ARRAY_TASK_MIN") ? number(env, "SLURM_ARRAY_TASK_MIN") : 0;
        int count;
        if (env.containsKey("SLURM_ARRAY_TASK_COUNT")) {
            count = number(env, "SLURM_ARRAY_TASK_COUNT");
        } else if (env.containsKey("SLURM_ARRAY_TASK_MAX")) {
            count = number(env, "SLURM_ARRAY_TASK_MAX") - min + 1;
        } else {
            throw new InputException("environment", "SLURM_ARRAY_TASK_ID", "is set but neither SLURM_ARRAY_TASK_COUNT nor "
                    + "SLURM_ARRAY_TASK_MAX is; pass --shard I/N");
        }
        int index = task - min;
        if (count < 1 || index < 0 || index >= count) {
            throw new InputException("environment", "SLURM_ARRAY_TASK_ID", "task " + task + " (min " + min + ", count " + count
                    + ") gives no shard in 0.." + (count - 1) + "; use a contiguous job array (e.g. --array=0-7) or pass --shard I/N");
        }
        return new Shard(index, count);
    }

    private static int number(Map<String, String> env, String name) {
        try {
            return Integer.parseInt(env.get(name).trim());
        } catch (NumberFormatException e) {
            throw new InputException("environment", name, "expected a whole number, found '" + env.get(name) + "'");
        }
    }
}
