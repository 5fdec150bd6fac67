// The live controls of nb.Explore: sends "seq;p0,p1,..." (the controls' positions) to the
// cell's program whenever one moves, and "seq;done" for the Done button, through GoNB's
// gonb_comm (installed by the kernel before this script runs).
(() => {
	const cfg = {{.Config}};
	const status = document.getElementById(cfg.Status);
	const comm = globalThis.gonb_comm;
	if (!comm) {
		if (status) status.textContent = "not connected to the kernel: the controls are not live";
		return;
	}
	const inputs = cfg.Controls.map((c) => document.getElementById(c.ID));
	const outs = cfg.Controls.map((c) => document.getElementById(c.Out));
	const done = document.getElementById(cfg.Done);
	let seq = 0;
	const send = (v) => comm.send(cfg.Address, (++seq) + ";" + v);
	const state = () => inputs.map((e) => e.value).join(",");
	inputs.forEach((e, i) => {
		const c = cfg.Controls[i];
		e.addEventListener(c.Labels ? "input" : "change", () => {
			if (c.Labels && outs[i]) outs[i].textContent = c.Labels[e.value];
			send(state());
		});
	});
	done.addEventListener("click", () => {
		inputs.forEach((e) => { e.disabled = true; });
		done.disabled = true;
		send("done");
	});
	send(state());
})();
