/**
 * The answer e-mail, sent by the worker (scripts/worker.ts) from the answer-mail queue, never
 * inside the request that saved the answer: a slow or broken mail server cannot fail an answer,
 * and the queue retries a failed send. The job carries only the question's id; the message is
 * composed when it is sent, so a question deleted or hidden meanwhile sends nothing.
 */
import { absoluteUrl, sendMail, type Message } from '../mail';
import { boardRepository as repo } from './repository';

export interface AnswerMailJob {
	questionId: number;
}

/** The message for a job, or null when there is nothing to send. */
export async function composeAnswerMail(job: AnswerMailJob): Promise<Message | null> {
	const found = await repo.questionWithPeople(job.questionId);
	if (!found || found.question.state === 'hidden') return null;
	const { question, askerName, askerEmail } = found;
	return {
		to: askerEmail,
		subject: `Your question has an answer: ${question.title}`,
		text: `Hello ${askerName},\n\nThe nursery has answered your question “${question.title}”. Read it, reply, or mark it resolved here:\n\n${absoluteUrl(`/questions/${question.id}`)}\n\nBunchline`
	};
}

/** The worker's handler: a send that throws is retried by the queue's policy. */
export async function runAnswerMailJob(job: AnswerMailJob, mail: (m: Message) => Promise<unknown> = sendMail): Promise<void> {
	const message = await composeAnswerMail(job);
	if (message) await mail(message);
}
